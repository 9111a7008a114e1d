import { SetMetadata } from '@nestjs/common';

export type Role = 'customer' | 'builder' | 'owner';
export const ROLES_KEY = 'roles';

/** Restricts a route to the listed roles (checked by the global roles guard after sign-in). */
export const Roles = (...roles: Role[]) => SetMetadata(ROLES_KEY, roles);
