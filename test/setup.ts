// Property tests in CI are reproducible: fast-check runs with one fixed seed unless QUERN_FUZZ_SEED says
// otherwise (`npm run fuzz` sets it to "random" for the long exploratory run; a failing run prints its seed,
// and QUERN_FUZZ_SEED=<that seed> replays it).
import fc from 'fast-check';

const given = process.env.QUERN_FUZZ_SEED;
const seed = given === undefined || given === '' ? 20_261_202 : given === 'random' ? (Date.now() ^ (Math.random() * 0x7fffffff)) | 0 : Number(given);
fc.configureGlobal({ seed });
