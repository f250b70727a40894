export { backgroundWorker, reasonOf, type BackgroundWorker, type WorkerSpec } from './worker';
