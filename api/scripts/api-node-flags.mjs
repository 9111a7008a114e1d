// V8 flags for the API process, used by `npm start` (stack.mjs) and `npm run replica`.
//
// --max-semi-space-size=32 (MB): an estimate answer allocates about 390 kB (the engine's answer,
// its JSON, the request's log line), so V8's default young generation (16 MB semi-spaces on 64-bit)
// filled every ~36 estimates and each scavenge paused every request in flight. With 32 MB the
// scavenges per 1,000 estimates halve (27.5 → 14.2, counted with --trace-gc) for up to 32 MB more
// resident memory; 64 MB halved them again without a steadier tail. DEVELOPERS.md, "Measured figures".
// API_NODE_FLAGS replaces the list (empty: V8's defaults).
export const apiNodeFlags = (process.env.API_NODE_FLAGS ?? '--max-semi-space-size=32').split(/\s+/).filter(Boolean);
