import { PageHeader } from '@/components/ui/page-header';
import { useDocumentTitle } from '@/hooks/use-document-title';

export function ModelNewRoute() {
  useDocumentTitle('New model');
  return <PageHeader title="New model" />;
}
