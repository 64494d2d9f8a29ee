/** A stand-in for Astro's cookie jar, recording what the sign-in module sets. */
import type { AstroCookies, AstroCookieSetOptions } from 'astro';

export interface RecordedCookie {
  name: string;
  value: string;
  options: AstroCookieSetOptions | undefined;
}

export function fakeCookies(initial: Record<string, string> = {}): { cookies: AstroCookies; set: RecordedCookie[] } {
  const jar = new Map(Object.entries(initial));
  const set: RecordedCookie[] = [];
  const cookies = {
    get: (name: string) => (jar.has(name) ? { value: jar.get(name)! } : undefined),
    has: (name: string) => jar.has(name),
    set: (name: string, value: string, options?: AstroCookieSetOptions) => {
      jar.set(name, value);
      set.push({ name, value, options });
    },
    delete: (name: string) => jar.delete(name),
  };
  return { cookies: cookies as unknown as AstroCookies, set };
}
