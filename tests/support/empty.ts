// Stands in for `server-only` outside Next's server bundle (unit tests, scripts).
export {};
