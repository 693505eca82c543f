// Public surface of the devices and the timer solver (owned by the solver work).
export {};
