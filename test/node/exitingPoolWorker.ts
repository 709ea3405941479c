// A stand-in pool worker for the tests: it dies on its first run without a word, as a thread
// killed by the system would, so the pool must notice from the missing signs of life.
import { parentPort } from 'node:worker_threads';

parentPort?.on('message', () => process.exit(3));
