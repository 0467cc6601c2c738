import { SetMetadata } from '@nestjs/common';

export const IS_PUBLIC = 'provenote:public';

/** Marks a route as reachable without signing in. Every other route requires a session. */
export const Public = () => SetMetadata(IS_PUBLIC, true);
