import { NextResponse, type NextRequest } from "next/server";

/**
 * Security headers on every page and route (nosniff, the referrer policy and the frame refusal
 * for every path, static files included, are in next.config.ts). Pages get a Content-Security-Policy with a fresh
 * nonce per request (Next.js reads it from the request's policy header and puts it on its own
 * scripts; every page here is rendered per request, so each gets its own). Styles allow inline
 * style attributes: React Flow positions nodes and the chart library draws with them, and a
 * style attribute cannot carry a nonce. The canvas engine runs in a Web Worker from our own
 * origin. API answers get a policy that allows nothing, as they are never documents.
 * HSTS only when the app is served over https: APP_URL says so, or a proxy that scripts/serve.ts
 * was told to trust (TRUST_PROXY) says the request came over https.
 */
export function proxy(request: NextRequest) {
  const isApi = request.nextUrl.pathname.startsWith("/api/");
  const dev = process.env.NODE_ENV === "development";
  const nonce = Buffer.from(crypto.getRandomValues(new Uint8Array(16))).toString("base64");
  const csp = isApi
    ? "default-src 'none'; frame-ancestors 'none'; base-uri 'none'; form-action 'none'"
    : [
        "default-src 'self'",
        // 'unsafe-eval': the unit conversions (mathjs and its typed-function dispatch) build
        // functions at run time on the Circuits page; scripts still need the nonce to load.
        `script-src 'self' 'nonce-${nonce}' 'strict-dynamic' 'unsafe-eval'`,
        "style-src 'self' 'unsafe-inline'",
        "img-src 'self' data: blob:",
        "font-src 'self' data:",
        `connect-src 'self'${dev ? " ws: wss:" : ""}`,
        "worker-src 'self' blob:",
        "manifest-src 'self'",
        "object-src 'none'",
        "base-uri 'self'",
        "form-action 'self'",
        "frame-ancestors 'none'",
      ].join("; ");

  const requestHeaders = new Headers(request.headers);
  if (!isApi) {
    requestHeaders.set("x-nonce", nonce);
    requestHeaders.set("Content-Security-Policy", csp);
  }
  const response = NextResponse.next({ request: { headers: requestHeaders } });
  response.headers.set("Content-Security-Policy", csp);
  const https =
    (process.env.APP_URL ?? "").startsWith("https:") || request.headers.get("x-forwarded-proto") === "https";
  if (https) response.headers.set("Strict-Transport-Security", "max-age=31536000; includeSubDomains");
  return response;
}

export const config = {
  // Static build assets are the app's own files; everything else (pages, API, the worker's
  // document requests) passes through here.
  matcher: ["/((?!_next/static|_next/image|favicon.ico).*)"],
};
