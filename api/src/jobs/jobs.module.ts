import { Module } from '@nestjs/common';
import { JobQueue } from './job-queue.service';

/** The process's one pg-boss instance, for the modules whose workers run on it (mail, messages, reminders). */
@Module({
  providers: [JobQueue],
  exports: [JobQueue],
})
export class JobsModule {}
