// 'server-only' throws outside a React Server environment; tests import server modules directly.
export {};
