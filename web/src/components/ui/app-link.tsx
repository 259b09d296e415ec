import { Link, type LinkProps } from '@chakra-ui/react';
import { Link as RouterLink } from 'react-router-dom';

/** A Chakra-styled link that navigates inside the app without a page load. */
export function AppLink({ to, children, ...props }: LinkProps & { to: string }) {
  return (
    <Link asChild {...props}>
      <RouterLink to={to}>{children}</RouterLink>
    </Link>
  );
}
