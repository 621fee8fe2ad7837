import { SetMetadata } from '@nestjs/common';

export const SKIP_CSRF = 'skyhours:skip-csrf';

/** For a POST that changes nothing on the server (the calculator); every other write needs the token. */
export const SkipCsrf = () => SetMetadata(SKIP_CSRF, true);
