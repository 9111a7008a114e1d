import { describe, expect, it } from 'vitest';
import { storefrontPaths } from '@loomwright/shared';
import { routes } from 'src/app/router';

describe('the pages the API lets through', () => {
  it('are exactly the pages of the router (any other address gets a 404 status)', () => {
    const children = routes[0]!.children ?? [];
    const paths = children.filter((r) => r.path !== '*').map((r) => (r.index ? '/' : `/${r.path}`));
    expect([...paths].sort()).toEqual([...storefrontPaths].sort());
  });
});
