import { PageHeader } from '@/components/ui/page-header';
import { useDocumentTitle } from '@/hooks/use-document-title';

export function ModelEditRoute() {
  useDocumentTitle('Edit model');
  return <PageHeader title="Edit model" />;
}
