// The instrument module's Node-only public surface: the worker-thread pool that designs a
// keyboard's bars in parallel (node:worker_threads). Browser code uses index.ts and web workers.
export * from './workerPool.ts';
export * from './keyboardBarWorkerUrl.ts';
