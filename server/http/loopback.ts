/**
 * "Is this request from this machine?" for the development-only routes. The answer comes from the
 * socket's address, never a header a client can write, and the Host header must name this machine
 * too: a DNS-rebinding page reaches us over loopback, but with its own host name.
 */

/** 127.0.0.0/8, ::1, and IPv4 loopback seen through an IPv6 socket (::ffff:127.x.y.z). */
export function isLoopbackAddress(address: string | undefined): boolean {
  if (!address) return false;
  const v4 = address.startsWith('::ffff:') ? address.slice('::ffff:'.length) : address;
  return /^127\.\d{1,3}\.\d{1,3}\.\d{1,3}$/.test(v4) || address === '::1';
}

/** A `HOST` to listen on that only this machine can reach: then the server says how to open it up. */
export function isLoopbackListenAddress(host: string): boolean {
  return host === 'localhost' || isLoopbackAddress(host);
}

const loopbackHostnames = new Set(['localhost', '127.0.0.1', '[::1]']);

/** The host name of a `Host` header value (`localhost:8080` → `localhost`), or null when unreadable. */
export function hostnameOf(host: string | undefined): string | null {
  if (!host) return null;
  try {
    return new URL(`http://${host}`).hostname;
  } catch {
    return null;
  }
}

/** localhost, 127.0.0.1 or [::1], on any port; `also` adds PUBLIC_URL's host name when configured. */
export function isLoopbackHost(host: string | undefined, also?: string | null): boolean {
  const hostname = hostnameOf(host);
  return hostname !== null && (loopbackHostnames.has(hostname) || (!!also && hostname === also));
}
