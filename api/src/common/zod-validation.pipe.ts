import { ArgumentMetadata, BadRequestException, Injectable, PipeTransform } from '@nestjs/common';
import { describeIssues, errorResponse, issuePath } from '@loomwright/shared';
import type { ZodType } from 'zod';

/**
 * The one way a request body or query is checked: by its zod schema from `@loomwright/shared`,
 * the same schema the apps' forms use, so both refuse the same input in the same words. Answers
 * 400 `validation_failed` with one line per problem in `details`, in plain words a person reads
 * (`message` joins them), and beside them `issues`: each problem with its field's path
 * ("pedals[3].currentMa") for a program that places a message under its field. The parsed value (trimmed, defaults filled in, unknown fields refused) is what
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
    const lines = describeIssues(result.error);
    const issues = result.error.issues.map((issue, i) => ({ path: issuePath(issue.path), message: lines[i] }));
    throw new BadRequestException({ ...errorResponse('validation_failed', ''), message: lines, issues });
  }
}
