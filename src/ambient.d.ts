// s3rver ships no types; only fakes/s3.js uses it.
declare module 's3rver';
