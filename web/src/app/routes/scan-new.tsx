import { PageHeader } from '@/components/ui/page-header';
import { useDocumentTitle } from '@/hooks/use-document-title';

export function ScanNewRoute() {
  useDocumentTitle('New scan');
  return <PageHeader title="New scan" />;
}
