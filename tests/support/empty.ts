// Stands in for the 'server-only' guard outside Next (Vitest).
export {};
