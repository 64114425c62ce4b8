// Stands in for the "server-only" marker package under vitest (it throws
// outside a React server bundle); the real package still guards the app.
export {};
