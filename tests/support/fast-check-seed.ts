import fc from 'fast-check';

// Property tests run with a fixed seed so CI is repeatable; FC_SEED=<n> replays or explores another run
// (fast-check prints the seed and path of any counterexample).
const seed = process.env.FC_SEED === 'random' ? Date.now() : Number(process.env.FC_SEED ?? 20261202);
fc.configureGlobal({ seed });
