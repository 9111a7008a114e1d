/**
 * The entry of a fake that `npm start` runs (api/scripts/stack.mjs): starts it with settings from
 * the environment, says where it listens, stops it on Ctrl-C or SIGTERM, and exits 1 in words
 * when it cannot start.
 */
export function runFake<Fake>(
  name: string,
  start: () => Promise<Fake>,
  where: (fake: Fake) => string,
  stop: (fake: Fake) => Promise<unknown>,
) {
  start().then(
    (fake) => {
      console.log(`[${name}] ${where(fake)}`);
      const onSignal = () => void stop(fake).then(() => process.exit(0));
      process.on('SIGINT', onSignal);
      process.on('SIGTERM', onSignal);
    },
    (error: Error) => {
      console.error(`[${name}] could not start: ${error.message}`);
      process.exit(1);
    },
  );
}
