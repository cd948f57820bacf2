/**
 * The server runs the production builds of its libraries (React's development build checks every
 * element and is several times slower) unless NODE_ENV says otherwise. Imported first by main.ts,
 * before anything that reads NODE_ENV when it loads.
 */
process.env.NODE_ENV ??= 'production';
export {};
