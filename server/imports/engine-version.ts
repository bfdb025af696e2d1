/** Recorded with every stored result and export, so a number can be traced to the code that made it. */
export const ENGINE_VERSION = '0.1.0';
