import type PgBoss from 'pg-boss';

/** PostgreSQL's SQLSTATE for a deadlock (Appendix A, "PostgreSQL Error Codes"). */
const DEADLOCK_DETECTED = '40P01';

/**
 * Creates a pg-boss queue if it is missing. pg-boss gives every queue its own table attached to the
 * shared job table, so two API processes booting at the same moment can deadlock in that DDL; the
 * loser is rolled back whole, so trying again after a short, jittered pause is safe, and the second
 * try finds the queue made. Any other error is thrown at once.
 */
export async function createQueue(boss: PgBoss, name: string, options: Omit<PgBoss.Queue, 'name'>, attempts = 5): Promise<void> {
  for (let attempt = 1; ; attempt++) {
    try {
      await boss.createQueue(name, { ...options, name });
      return;
    } catch (error) {
      if ((error as { code?: string }).code !== DEADLOCK_DETECTED || attempt >= attempts) throw error;
      await new Promise((resolve) => setTimeout(resolve, 50 * attempt + Math.random() * 100));
    }
  }
}
