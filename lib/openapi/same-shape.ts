/**
 * Compile-time checks that a documented zod shape and the TypeScript type a handler
 * returns are the same: `Assert<Same<A, B>>` compiles only when they are.
 */
export type Same<A, B> = (<T>() => T extends A ? 1 : 2) extends <T>() => T extends B ? 1 : 2 ? true : false;
export type Assert<T extends true> = T;
