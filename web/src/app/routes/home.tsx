import { PageHeader } from '@/components/ui/page-header';
import { useDocumentTitle } from '@/hooks/use-document-title';

export function HomeRoute() {
  useDocumentTitle('Overview');
  return <PageHeader title="Overview" />;
}
