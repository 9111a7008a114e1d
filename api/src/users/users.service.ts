import { Injectable } from '@nestjs/common';
import type { AuthUser, UserRole } from '@loomwright/shared';
import type { Selectable } from 'kysely';
import type { Executor, UsersTable } from '../database/database';
import { UsersRepository } from './users.repository';

export type UserRow = Selectable<UsersTable>;

export const toAuthUser = (row: UserRow): AuthUser => ({ id: row.id, email: row.email, name: row.name, role: row.role });

@Injectable()
export class UsersService {
  constructor(private readonly users: UsersRepository) {}

  findByEmail(email: string, trx?: Executor) {
    return this.users.findByEmail(email, trx);
  }

  findById(id: string, trx?: Executor) {
    return this.users.findById(id, trx);
  }

  create(input: { email: string; name: string; role: UserRole; passwordHash: string | null }, trx?: Executor) {
    return this.users.insert(
      { email: input.email.trim(), name: input.name.trim(), role: input.role, password_hash: input.passwordHash },
      trx,
    );
  }

  setPassword(id: string, passwordHash: string, trx?: Executor) {
    return this.users.update(id, { password_hash: passwordHash, password_changed_at: new Date() }, trx);
  }

  recordSignIn(id: string, trx?: Executor) {
    return this.users.update(id, { last_sign_in_at: new Date() }, trx);
  }
}
