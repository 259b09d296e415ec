import { SetMetadata } from '@nestjs/common';

export const IS_PUBLIC = 'sixtyfold:isPublic';

/** Opens a route to callers who are not signed in; every other route needs a session. */
export const Public = () => SetMetadata(IS_PUBLIC, true);
