import { NotFoundPage } from '@loomwright/shared/ui';

export function Component() {
  return <NotFoundPage hint="The link may be old. Pick a page from the menu." homeLabel="Go to the overview" />;
}
