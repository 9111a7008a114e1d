import type { Kysely } from 'kysely';
import { hashPassword } from '../../auth/password';
import type { DB } from '../database';

export const DEMO_PASSWORD = 'demo-pass-2026';

/** Invented people of the invented demo shop. Names and addresses are ours; none is real. */
export const demoPeople = [
  { email: 'owner@shop.example', name: 'Odile Varga', role: 'owner' },
  { email: 'builder@shop.example', name: 'Teodor Lind', role: 'builder', level: 'master', rate: '125.00' },
  { email: 'wren@shop.example', name: 'Wren Castellan', role: 'builder', level: 'journeyman', rate: '90.00' },
  { email: 'junior@shop.example', name: 'Pip Okonkwo-Hale', role: 'builder', level: 'apprentice', rate: '45.00' },
  { email: 'player@mail.example', name: 'Rowan Achterberg', role: 'customer' },
  { email: 'cass@mail.example', name: 'Cass Imbert', role: 'customer' },
] as const;

const fullDays = { '1': 7, '2': 7, '3': 7, '4': 7, '5': 6 };
const apprenticeDays = { '2': 6, '3': 6, '4': 6, '5': 6 };

export async function seedPeople(db: Kysely<DB>): Promise<void> {
  const hash = await hashPassword(DEMO_PASSWORD);
  for (const person of demoPeople) {
    const user = await db
      .insertInto('users')
      .values({ email: person.email, name: person.name, role: person.role, password_hash: hash })
      .onConflict((oc) => oc.column('email').doNothing())
      .returning('id')
      .executeTakeFirst();
    if (!user || !('level' in person)) continue;
    await db
      .insertInto('builders')
      .values({
        user_id: user.id,
        level: person.level,
        hourly_rate: person.rate,
        weekly_hours: JSON.stringify(person.level === 'apprentice' ? apprenticeDays : fullDays),
      })
      .onConflict((oc) => oc.column('user_id').doNothing())
      .execute();
  }
}
