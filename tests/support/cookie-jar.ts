/** The cookies a browser would keep between requests to the app: set, replaced, and dropped when cleared. */
export class CookieJar {
  cookies = new Map<string, string>();
  header = () => [...this.cookies].map(([k, v]) => `${k}=${v}`).join("; ");
  take(res: Response) {
    for (const line of res.headers.getSetCookie()) {
      const [pair] = line.split(";");
      const i = pair.indexOf("=");
      const value = pair.slice(i + 1);
      // next-auth clears a cookie by an empty value, Max-Age=0 or an Expires in 1970.
      if (value === "" || /Max-Age=0/i.test(line) || /Expires=Thu, 01 Jan 1970/i.test(line)) this.cookies.delete(pair.slice(0, i));
      else this.cookies.set(pair.slice(0, i), value);
    }
  }
}
