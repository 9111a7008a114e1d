import { BadRequestException, Injectable, PipeTransform } from '@nestjs/common';
import { describeIssues } from '@loomwright/shared';
import type { ZodType } from 'zod';

/**
 * Validates a body with one of the shared zod schemas, so the API and the storefront's forms
 * reject the same input in the same words. Answers 400 with one message per field, each naming
 * its path (Nest's own error shape: `message` is a list of strings).
 */
@Injectable()
export class ZodValidationPipe<T> implements PipeTransform<unknown, T> {
  constructor(private readonly schema: ZodType<T>) {}

  transform(value: unknown): T {
    const result = this.schema.safeParse(value);
    if (result.success) return result.data;
    throw new BadRequestException(describeIssues(result.error));
  }
}
