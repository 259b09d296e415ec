import { PageHeader } from '@/components/ui/page-header';
import { useDocumentTitle } from '@/hooks/use-document-title';

export function ScanRoute() {
  useDocumentTitle('Scan');
  return <PageHeader title="Scan" />;
}
