import { ArgumentMetadata, BadRequestException, Injectable, PipeTransform } from '@nestjs/common';
import { describeIssues, errorResponse } from '@loomwright/shared';
import type { ZodType } from 'zod';

/**
 * The one way a request body or query is checked: by its zod schema from `@loomwright/shared`,
 * the same schema the apps' forms use, so both refuse the same input in the same words. Answers
 * 400 `validation_failed` with one line per field in `details`, each naming its path (`message`
 * joins them). The parsed value (trimmed, defaults filled in, unknown fields refused) is what
 * the controller receives.
 */
@Injectable()
export class ZodValidationPipe<T> implements PipeTransform<unknown, T> {
  constructor(private readonly schema: ZodType<T>) {}

  transform(value: unknown, metadata?: ArgumentMetadata): T {
    // No body at all reads as an empty one, so a missing field is named rather than the body.
    const input = value === undefined && metadata?.type !== 'param' ? {} : value;
    const result = this.schema.safeParse(input);
    if (result.success) return result.data;
    throw new BadRequestException({ ...errorResponse('validation_failed', ''), message: describeIssues(result.error) });
  }
}
