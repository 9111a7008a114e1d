/**
 * The board both latency measurements open: a configuration link (base64url JSON, the storefront's
 * codec) with a surface, a case and six counted pedals. Nothing is priced until all three are chosen.
 */
export function latencyBoardLink() {
  const configuration = {
    surfaceId: 'ridge-100',
    caseId: 'shell-hard',
    routing: { mode: 'serial' },
    pedalCount: 6,
    functions: [],
    level: 'apprentice',
  };
  return Buffer.from(JSON.stringify(configuration), 'utf8').toString('base64url');
}
