import { SetMetadata } from '@nestjs/common';

export const ADMIN_ONLY = 'sixtyfold:adminOnly';

/** Restricts a route (or a whole controller) to site administrators. */
export const AdminOnly = () => SetMetadata(ADMIN_ONLY, true);
