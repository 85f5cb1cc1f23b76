import type { Account, AdminUser } from '@shared/schemas/auth';
import type { UserEntity } from '../entities/user.entity';

export function presentAccount(u: UserEntity): Account {
  return {
    id: u.id,
    email: u.email,
    displayName: u.displayName,
    role: u.role,
    unitSystem: u.unitSystem,
    language: u.language,
    emailVerified: u.emailVerifiedAt !== null,
    createdAt: u.createdAt.toISOString(),
  };
}

export function presentAdminUser(u: UserEntity): AdminUser {
  return { ...presentAccount(u), disabled: u.disabledAt !== null };
}
