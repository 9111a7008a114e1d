import { ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { createHash, randomInt } from 'node:crypto';
import stableStringify from 'fast-json-stable-stringify';
import {
  configurationMessages,
  MAX_SAVED_CONFIGURATIONS,
  shortLinkPath,
  type AuthUser,
  type ConfigurationLink,
  type RigConfiguration,
  type SavedConfiguration,
  type SavedConfigurationSummary,
  type SaveConfigurationInput,
  type SharedConfiguration,
  type UpdateConfigurationInput,
} from '@loomwright/shared';
import { Database } from '../database/database';
import { EstimatesService } from '../estimates/estimates.service';
import { ConfigurationsRepository } from './configurations.repository';

const UNIQUE_VIOLATION = '23505';
const CODE_ALPHABET = 'ABCDEFGHJKLMNPQRSTUVWXYZabcdefghijkmnopqrstuvwxyz23456789';
/** 8 characters of a 57-letter alphabet: about 1.1e14 codes, so a guessed code finds nothing. */
const CODE_LENGTH = 8;

type Row = { id: string; name: string; configuration: RigConfiguration; created_at: Date; updated_at: Date };

function summaryOf(row: Row): SavedConfigurationSummary {
  const c = row.configuration;
  return {
    id: row.id,
    name: row.name,
    createdAt: new Date(row.created_at).toISOString(),
    updatedAt: new Date(row.updated_at).toISOString(),
    surfaceId: c.surfaceId,
    routing: c.routing.mode,
    pedalCount: c.pedals?.length ?? c.pedalCount ?? 0,
  };
}
const viewOf = (row: Row): SavedConfiguration => ({ ...summaryOf(row), configuration: row.configuration });

/** "Stage board (copy)", then "(copy 2)", … : the first a player does not already use. */
export function copyName(name: string, taken: readonly string[]): string {
  const used = new Set(taken.map((n) => n.toLowerCase()));
  const base = name.replace(/ \(copy( \d+)?\)$/, '').slice(0, 100);
  for (let n = 1; ; n += 1) {
    const candidate = `${base} (copy${n === 1 ? '' : ` ${n}`})`;
    if (!used.has(candidate.toLowerCase())) return candidate;
  }
}

@Injectable()
export class ConfigurationsService {
  constructor(
    private readonly db: Database,
    private readonly repo: ConfigurationsRepository,
    private readonly estimates: EstimatesService,
  ) {}

  async list(user: AuthUser): Promise<SavedConfigurationSummary[]> {
    return (await this.repo.listFor(user.id)).map(summaryOf);
  }

  async get(user: AuthUser, id: string): Promise<SavedConfiguration> {
    const row = await this.repo.findFor(user.id, id);
    if (!row) throw new NotFoundException(configurationMessages.notFound);
    return viewOf(row);
  }

  async save(user: AuthUser, input: SaveConfigurationInput): Promise<SavedConfiguration> {
    const configuration = await this.checked(input.configuration as RigConfiguration);
    return this.write(input.name, () =>
      this.db.transaction().execute(async (trx) => {
        await this.repo.lockOwner(trx, user.id);
        if ((await this.repo.countFor(user.id, trx)) >= MAX_SAVED_CONFIGURATIONS)
          throw new ConflictException(configurationMessages.tooMany);
        return viewOf(await this.repo.insert(trx, user.id, input.name, configuration));
      }),
    );
  }

  async update(user: AuthUser, id: string, input: UpdateConfigurationInput): Promise<SavedConfiguration> {
    const configuration = input.configuration ? await this.checked(input.configuration as RigConfiguration) : undefined;
    return this.write(input.name ?? '', async () => {
      const row = await this.repo.update(this.db, user.id, id, { name: input.name, configuration });
      if (!row) throw new NotFoundException(configurationMessages.notFound);
      return viewOf(row);
    });
  }

  async duplicate(user: AuthUser, id: string, name: string | undefined): Promise<SavedConfiguration> {
    return this.db.transaction().execute(async (trx) => {
      await this.repo.lockOwner(trx, user.id);
      const source = await this.repo.findFor(user.id, id, trx);
      if (!source) throw new NotFoundException(configurationMessages.notFound);
      if ((await this.repo.countFor(user.id, trx)) >= MAX_SAVED_CONFIGURATIONS) throw new ConflictException(configurationMessages.tooMany);
      const copy = name ?? copyName(source.name, await this.repo.namesFor(user.id, trx));
      return this.write(copy, async () => viewOf(await this.repo.insert(trx, user.id, copy, source.configuration)));
    });
  }

  async remove(user: AuthUser, id: string): Promise<void> {
    if ((await this.repo.delete(this.db, user.id, id)) === 0) throw new NotFoundException(configurationMessages.notFound);
  }

  /** A short code for any configuration; the same configuration always gets the same code. */
  async link(configuration: RigConfiguration): Promise<ConfigurationLink> {
    const checked = await this.checked(configuration);
    const digest = createHash('sha256').update(stableStringify(checked)).digest('hex');
    for (let attempt = 1; ; attempt += 1) {
      const fresh = Array.from({ length: CODE_LENGTH }, () => CODE_ALPHABET[randomInt(CODE_ALPHABET.length)]).join('');
      try {
        const code = await this.repo.upsertLink(fresh, digest, checked);
        return { code, path: shortLinkPath(code) };
      } catch (error) {
        // A new code that happens to equal an old one: draw again (vanishingly rare).
        if ((error as { code?: string }).code !== UNIQUE_VIOLATION || attempt >= 3) throw error;
      }
    }
  }

  async openLink(code: string): Promise<SharedConfiguration> {
    const configuration = await this.repo.openLink(code);
    if (!configuration) throw new NotFoundException(configurationMessages.linkNotFound);
    return { configuration };
  }

  /** A configuration the current price book can price (a surface it holds, …); else 400 naming the field. */
  private async checked(configuration: RigConfiguration): Promise<RigConfiguration> {
    await this.estimates.price(configuration);
    return configuration;
  }

  /** Runs a write, turning the one-name-per-player index into 409 in words. */
  private async write<T>(name: string, run: () => Promise<T>): Promise<T> {
    try {
      return await run();
    } catch (error) {
      if ((error as { code?: string; constraint?: string }).code === UNIQUE_VIOLATION)
        throw new ConflictException(configurationMessages.nameTaken(name));
      throw error;
    }
  }
}
