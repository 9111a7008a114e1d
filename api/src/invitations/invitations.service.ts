import { BadRequestException, ConflictException, Injectable } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { authMessages, type AuthUser, type InvitationCreated, type InviteStaffInput, type WeeklyHours } from '@loomwright/shared';
import { AuthTokensService } from '../auth/auth-tokens.service';
import { hashPassword } from '../auth/password';
import type { AppConfig } from '../config/configuration';
import { Database } from '../database/database';
import { MailService } from '../mail/mail.service';
import { toAuthUser, UsersService } from '../users/users.service';
import { InvitationsRepository } from './invitations.repository';

/** A new builder's bench week until the owner changes it: Monday to Friday, 7 hours a day. */
export const DEFAULT_WEEKLY_HOURS: WeeklyHours = { '1': 7, '2': 7, '3': 7, '4': 7, '5': 7 };

@Injectable()
export class InvitationsService {
  constructor(
    private readonly db: Database,
    private readonly users: UsersService,
    private readonly tokens: AuthTokensService,
    private readonly mail: MailService,
    private readonly invitations: InvitationsRepository,
    private readonly config: ConfigService<AppConfig, true>,
  ) {}

  /**
   * Creates the builder's account (no password yet) and bench profile, and e-mails a single-use
   * link to choose a password. Inviting someone who was invited but never accepted sends a fresh
   * link (the old one stops working) and updates their level and rate.
   */
  async invite(input: InviteStaffInput, invitedBy: AuthUser): Promise<InvitationCreated> {
    const lifetimeMs = this.config.get('auth', { infer: true }).staffInviteDays * 24 * 3600_000;
    const publicUrl = this.config.get('app', { infer: true }).publicUrl;
    return this.db.transaction().execute(async (trx) => {
      const existing = await this.users.findByEmail(input.email, trx);
      let user: AuthUser;
      let builderId: string;
      const resent = !!existing;
      if (existing) {
        if (existing.role !== 'builder' || existing.password_hash) {
          throw new ConflictException('Someone already has an account with this e-mail; invite a different address.');
        }
        const builder = await this.invitations.updateBuilder(existing.id, input, trx);
        builderId = builder?.id ?? (await this.invitations.insertBuilder({ userId: existing.id, ...input, weeklyHours: DEFAULT_WEEKLY_HOURS }, trx)).id;
        user = toAuthUser(existing);
      } else {
        const row = await this.users.create({ email: input.email, name: input.name, role: 'builder', passwordHash: null }, trx);
        builderId = (await this.invitations.insertBuilder({ userId: row.id, ...input, weeklyHours: DEFAULT_WEEKLY_HOURS }, trx)).id;
        user = toAuthUser(row);
      }
      const { token, expiresAt } = await this.tokens.issue(trx, user.id, 'staff_invite', lifetimeMs);
      await this.mail.enqueue(trx, {
        template: 'staff-invite',
        to: user.email,
        userId: user.id,
        data: {
          name: user.name,
          invitedBy: invitedBy.name,
          level: input.level,
          hourlyRate: input.hourlyRate,
          acceptUrl: `${publicUrl}/backoffice/accept-invite?token=${encodeURIComponent(token)}`,
          expiresAt: expiresAt.toISOString(),
        },
      });
      return { user, builderId, expiresAt: expiresAt.toISOString(), resent };
    });
  }

  /** Spends the invitation token and sets the builder's first password. */
  async accept(token: string, password: string): Promise<AuthUser> {
    const passwordHash = await hashPassword(password);
    return this.db.transaction().execute(async (trx) => {
      const userId = await this.tokens.consume(trx, token, 'staff_invite');
      if (!userId) throw new BadRequestException(authMessages.inviteTokenInvalid);
      const row = await this.users.setPassword(userId, passwordHash, trx);
      if (!row) throw new BadRequestException(authMessages.inviteTokenInvalid);
      await this.users.recordSignIn(userId, trx);
      return toAuthUser(row);
    });
  }
}
