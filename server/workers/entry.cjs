// Worker thread entry for the piscina pool (server/jobs/worker-pool.ts). Plain CommonJS so it loads the same
// under `npm start` (tsx) and under jest (babel, which does not reach worker threads): it registers tsx's
// CommonJS hook first, then loads the TypeScript workers. Each export is a task name.
require('tsx/cjs');
const { runTrialTask } = require('./trial-worker.ts');
const { runCandidateTask } = require('./candidate-worker.ts');

module.exports = { trial: runTrialTask, candidate: runCandidateTask };
