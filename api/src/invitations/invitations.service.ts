import { BadRequestException, ConflictException, Injectable, NotFoundException, OnModuleInit } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import {
  authMessages,
  errorResponse,
  type AuthUser,
  type InvitationCreated,
  type InvitationResent,
  type InviteStaffInput,
  type WeeklyHours,
} from '@loomwright/shared';
import { AuthTokensService } from '../auth/auth-tokens.service';
import { hashPassword } from '../auth/password';
import type { AppConfig } from '../config/configuration';
import { Database, type Executor } from '../database/database';
import { MailService, type MessageToRenew } from '../mail/mail.service';
import { toAuthUser, UsersService } from '../users/users.service';
import { BenchRepository } from '../bench/bench.repository';

/** A new builder's bench week until the owner changes it: Monday to Friday, 7 hours a day. */
export const DEFAULT_WEEKLY_HOURS: WeeklyHours = { '1': 7, '2': 7, '3': 7, '4': 7, '5': 7 };

@Injectable()
export class InvitationsService implements OnModuleInit {
  constructor(
    private readonly db: Database,
    private readonly users: UsersService,
    private readonly tokens: AuthTokensService,
    private readonly mail: MailService,
    private readonly bench: BenchRepository,
    private readonly config: ConfigService<AppConfig, true>,
  ) {}

  onModuleInit() {
    this.mail.renewLinksWith('staff-invite', (trx, message) => this.renewInviteLink(trx, message));
  }

  /**
   * Creates the builder's account (no password yet) and bench profile, and e-mails a single-use
   * link to choose a password. Inviting someone who was invited but never accepted sends a fresh
   * link (the old one stops working) and updates their level and rate.
   */
  async invite(input: InviteStaffInput, invitedBy: AuthUser): Promise<InvitationCreated> {
    return this.db.transaction().execute(async (trx) => {
      const existing = await this.users.findByEmail(input.email, trx);
      let user: AuthUser;
      let builderId: string;
      const resent = !!existing;
      if (existing) {
        if (existing.role !== 'builder' || existing.password_hash) {
          throw new ConflictException(
            errorResponse('email_taken', 'Someone already has an account with this e-mail; invite a different address.'),
          );
        }
        const builder = await this.bench.updateBuilderOfUser(existing.id, input, trx);
        builderId =
          builder?.id ?? (await this.bench.insertBuilder({ userId: existing.id, ...input, weeklyHours: DEFAULT_WEEKLY_HOURS }, trx)).id;
        user = toAuthUser(existing);
      } else {
        const row = await this.users.create({ email: input.email, name: input.name, role: 'builder', passwordHash: null }, trx);
        builderId = (await this.bench.insertBuilder({ userId: row.id, ...input, weeklyHours: DEFAULT_WEEKLY_HOURS }, trx)).id;
        user = toAuthUser(row);
      }
      const link = await this.inviteLink(trx, user.id);
      await this.mail.enqueue(trx, {
        template: 'staff-invite',
        to: user.email,
        userId: user.id,
        data: { name: user.name, invitedBy: invitedBy.name, level: input.level, ...link },
      });
      return { user, builderId, expiresAt: link.expiresAt, resent };
    });
  }

  /**
   * The Team page's "Resend invitation": a fresh single-use link to the same person at the level
   * and rate they are on now; the link mailed before stops working in the same transaction.
   */
  async resend(builderId: string, invitedBy: AuthUser): Promise<InvitationResent> {
    return this.db.transaction().execute(async (trx) => {
      const row = await this.bench.lockInvitedBuilder(builderId, trx);
      if (!row) throw new NotFoundException('There is no builder with that id on the team.');
      if (row.password_hash) {
        throw new ConflictException(
          `${row.name} has already accepted the invitation and chosen a password, so there is nothing to resend.`,
        );
      }
      const link = await this.inviteLink(trx, row.user_id);
      await this.mail.enqueue(trx, {
        template: 'staff-invite',
        to: row.email,
        userId: row.user_id,
        data: { name: row.name, invitedBy: invitedBy.name, level: row.level, ...link },
      });
      return { builderId: row.id, email: row.email, expiresAt: link.expiresAt };
    });
  }

  /** A new single-use invitation link (older unused ones stop working). */
  private async inviteLink(trx: Executor, userId: string) {
    const lifetimeMs = this.config.get('auth', { infer: true }).staffInviteDays * 24 * 3600_000;
    const publicUrl = this.config.get('app', { infer: true }).publicUrl;
    const { token, expiresAt } = await this.tokens.issue(trx, userId, 'staff_invite', lifetimeMs);
    return { inviteUrl: `${publicUrl}/backoffice/accept-invite?token=${encodeURIComponent(token)}`, expiresAt: expiresAt.toISOString() };
  }

  /** The owner resends an invitation: a fresh link while it is still pending, and only to the same address. */
  private async renewInviteLink(trx: Executor, message: MessageToRenew) {
    const row = message.userId ? await this.users.findById(message.userId, trx) : undefined;
    if (!row || row.role === 'customer') {
      throw new ConflictException('The account this invitation was for no longer exists; invite the person again from the team page.');
    }
    if (row.password_hash) {
      throw new ConflictException(`${row.name} has already accepted this invitation and chosen a password, so there is nothing to resend.`);
    }
    if (row.email.toLowerCase() !== message.to.toLowerCase()) {
      throw new ConflictException(
        'This invitation was for an address the account no longer uses; invite the person again from the team page.',
      );
    }
    return { ...message.data, ...(await this.inviteLink(trx, row.id)) };
  }

  /** Spends the invitation token and sets the builder's first password. */
  async accept(token: string, password: string): Promise<AuthUser> {
    const passwordHash = await hashPassword(password);
    return this.db.transaction().execute(async (trx) => {
      const userId = await this.tokens.consume(trx, token, 'staff_invite');
      if (!userId) throw new BadRequestException(errorResponse('link_invalid', authMessages.inviteTokenInvalid));
      const row = await this.users.setPassword(userId, passwordHash, trx);
      if (!row) throw new BadRequestException(errorResponse('link_invalid', authMessages.inviteTokenInvalid));
      await this.users.recordSignIn(userId, trx);
      return toAuthUser(row);
    });
  }
}
