import { PageHeader } from '@/components/ui/page-header';
import { useDocumentTitle } from '@/hooks/use-document-title';

export function ModelRoute() {
  useDocumentTitle('Model');
  return <PageHeader title="Model" />;
}
