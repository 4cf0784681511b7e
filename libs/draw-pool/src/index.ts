/** Worker threads for uncertainty draws and other engine work (Node only; the engine libs stay pure). */
export * from './draw-pool';
export * from './worker-pool';
export * from './worker-priority';
