import { ConflictException } from '@nestjs/common';
import { errorResponse } from '@loomwright/shared';
import type { Database, Executor } from '../database/database';

const EXCLUSION_VIOLATION = '23P01';
const CHECK_VIOLATION = '23514';

/**
 * Runs work that writes bench slices in one transaction. The exclusion constraint (overlapping
 * slices) and the capacity check are the last guard against two planners racing for the same
 * hours: either refusal means someone else got there first, said in words as a 409.
 */
export async function inBenchTransaction<T>(db: Database, work: (trx: Executor) => Promise<T>): Promise<T> {
  try {
    return await db.transaction().execute(work);
  } catch (error) {
    const code = (error as { code?: string }).code;
    if (code === EXCLUSION_VIOLATION || code === CHECK_VIOLATION) {
      throw new ConflictException(errorResponse('bench_time_taken', 'That bench time was just taken; pick another date.'));
    }
    throw error;
  }
}
