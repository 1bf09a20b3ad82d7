/** True when `path` is `ancestor` or lies below it (checkout/payment is below checkout). */
export function isSameOrBelow(path: string, ancestor: string): boolean {
  return path === ancestor || path.startsWith(`${ancestor}/`);
}

/** Two surfaces meet when one is the other or lies below it. */
export function surfacesMeet(a: string, b: string): boolean {
  return isSameOrBelow(a, b) || isSameOrBelow(b, a);
}
