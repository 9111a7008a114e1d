/** PostgreSQL's SQLSTATE for a deadlock (Appendix A, "PostgreSQL Error Codes"). */
export const DEADLOCK_DETECTED = '40P01';

/**
 * Runs a whole transaction again when PostgreSQL broke a deadlock by rolling it back. The loser of a
 * deadlock is rolled back whole, so a transaction that does nothing outside the database (or only
 * calls that are idempotent by key, like the payment provider's refunds) can simply be tried again
 * after a short, jittered pause. Any other error is thrown at once, and so is the last deadlock.
 */
export async function retryOnDeadlock<T>(work: () => Promise<T>, attempts = 4): Promise<T> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await work();
    } catch (error) {
      if ((error as { code?: string }).code !== DEADLOCK_DETECTED || attempt >= attempts) throw error;
      await new Promise((resolve) => setTimeout(resolve, 25 * attempt + Math.random() * 50));
    }
  }
}
