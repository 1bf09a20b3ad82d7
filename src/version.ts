/** The release version; scripts/build.mjs checks that it matches package.json. */
export const VERSION = '0.1.0';
