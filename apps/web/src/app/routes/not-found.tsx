import { Button } from '@chakra-ui/react';
import { Compass } from 'lucide-react';
import { Link as RouterLink, useLocation } from 'react-router-dom';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { paths } from '@/lib/paths';

export function NotFoundPage() {
  const { pathname } = useLocation();
  return (
    <>
      <PageHeader title="Page not found" />
      <EmptyState
        icon={Compass}
        title="There is no page at this address"
        description={
          <>
            Nothing in Skyhours lives at <code>{pathname}</code>. The link may be old or mistyped.
          </>
        }
        action={
          <Button asChild>
            <RouterLink to={paths.desk}>Go to the Desk</RouterLink>
          </Button>
        }
      />
    </>
  );
}
