// Bump when a formula, a device fact or the solver's choice changes: it is
// written into every revision and bundle so a reviewer can tell engines apart.
export const ENGINE_VERSION = "1.0.0";
