// Public surface of the analog stage models (owned by the stage-model work).
export {};
