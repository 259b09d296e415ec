import { PageHeader } from '@/components/ui/page-header';
import { useDocumentTitle } from '@/hooks/use-document-title';

export function PointRoute() {
  useDocumentTitle('Point');
  return <PageHeader title="Point" />;
}
