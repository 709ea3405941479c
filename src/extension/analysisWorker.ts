// Worker-thread entry (dist/analysisWorker.js): keeps long exact searches off the extension host's
// main thread. A browser build would host the same job in a Web Worker.
import { parentPort } from 'node:worker_threads';
import { runAnalysisJob, type JobToWorker } from '../core/analysisJob';

parentPort?.on('message', (message: JobToWorker) => {
  runAnalysisJob(message, (reply) => parentPort?.postMessage(reply));
});
