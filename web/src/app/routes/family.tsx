import { PageHeader } from '@/components/ui/page-header';
import { useDocumentTitle } from '@/hooks/use-document-title';

export function FamilyRoute() {
  useDocumentTitle('Family');
  return <PageHeader title="Family" />;
}
