import { SetMetadata } from '@nestjs/common';

export const IS_PUBLIC = 'skyhours:public';

/** Opens a route to visitors who are not signed in. Everything else needs a session. */
export const Public = () => SetMetadata(IS_PUBLIC, true);
