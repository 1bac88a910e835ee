/** Vite bundles style sheets imported for their side effect; TypeScript only needs to know they exist. */
declare module '*.css';
