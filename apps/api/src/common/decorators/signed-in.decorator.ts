import { SetMetadata } from '@nestjs/common';

export const SIGNED_IN = 'skyhours:signed-in';

/**
 * Any signed-in user may call the route (rights on the resource are checked in the service).
 * Says so explicitly, so that the route audit can tell a deliberate choice from a forgotten one.
 */
export const SignedIn = () => SetMetadata(SIGNED_IN, true);
