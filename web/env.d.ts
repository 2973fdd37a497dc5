// Vite's client-side types (import.meta.glob, ?worker imports, JSON modules) for the workbench.
/// <reference types="vite/client" />
