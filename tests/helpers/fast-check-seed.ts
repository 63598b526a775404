import fc from 'fast-check';

// Property tests run from one fixed seed, so a failure (or a mutant's kill) never depends on chance; set FC_SEED to
// explore other seeds. On a failure fast-check prints the seed and path that replay it.
const DEFAULT_SEED = 20_261_118;
const raw = process.env.FC_SEED;
const seed = raw === undefined || raw === '' ? DEFAULT_SEED : Number(raw);
if (!Number.isSafeInteger(seed)) throw new Error(`FC_SEED must be a whole number, not "${raw}"`);

// Under `npm run mutate` a failure only has to be seen, not shrunk to its smallest form: that saves minutes.
const mutating = process.env.STRYKER_MUTATOR_WORKER !== undefined;

fc.configureGlobal({ ...fc.readConfigureGlobal(), seed, ...(mutating ? { endOnFailure: true } : {}) });
