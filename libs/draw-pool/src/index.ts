/** Worker threads for uncertainty draws (Node only; the engine libs stay pure). */
export * from './draw-pool';
