// Worker thread entry for the upload reader pool (server/services/gltf-import-pool.ts). Plain CommonJS for the
// same reason as entry.cjs: it registers tsx's CommonJS hook, then loads the TypeScript worker.
require('tsx/cjs');
const { runImportTask } = require('./gltf-import-worker.ts');

module.exports = { importGltf: runImportTask };
