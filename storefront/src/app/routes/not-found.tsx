import { NotFoundPage } from '@loomwright/shared/ui';

export function Component() {
  return <NotFoundPage hint="The link may be old. Start again from the home page." homeLabel="Go to the home page" />;
}
