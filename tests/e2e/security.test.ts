import { describe, expect, it } from "vitest";
import { baseUrl } from "./browser";

// Checked against the running production build, where headers come from next.config.mjs.
describe("security headers and cookie flags on the built app", () => {
  it.each(["/sign-in", "/api/health", "/settings"])("%s carries the security headers", async (p) => {
    const r = await fetch(`${baseUrl()}${p}`, { redirect: "manual" });
    const csp = r.headers.get("content-security-policy") ?? "";
    expect(csp).toContain("default-src 'self'");
    expect(csp).toContain("frame-ancestors 'none'");
    expect(csp).not.toContain("unsafe-eval");
    expect(r.headers.get("x-content-type-options")).toBe("nosniff");
    expect(r.headers.get("x-frame-options")).toBe("DENY");
    expect(r.headers.get("referrer-policy")).toBe("same-origin");
    expect(r.headers.get("x-powered-by")).toBeNull();
  });

  it("/favicon.ico answers with the app's icon, not a 404 (browsers ask for it on their own)", async () => {
    const r = await fetch(`${baseUrl()}/favicon.ico`);
    expect(r.status).toBe(200);
    expect(r.headers.get("content-type")).toBe("image/svg+xml");
    expect(await r.text()).toMatch(/^<svg /);
    expect(r.headers.get("x-content-type-options")).toBe("nosniff");
  });

  it("the session cookie is HttpOnly and SameSite=Lax, and Secure behind https", async () => {
    const body = JSON.stringify({ email: "operator@bramblecote.test", password: "coatwright-demo" });
    const plain = await fetch(`${baseUrl()}/api/auth/sign-in`, { method: "POST", headers: { "content-type": "application/json" }, body });
    const cookie = plain.headers.get("set-cookie") ?? "";
    expect(cookie).toMatch(/HttpOnly/);
    expect(cookie).toMatch(/SameSite=Lax/);
    const tls = await fetch(`${baseUrl()}/api/auth/sign-in`, {
      method: "POST",
      headers: { "content-type": "application/json", "x-forwarded-proto": "https" },
      body,
    });
    expect(tls.headers.get("set-cookie")).toMatch(/Secure/);
  });

  it("a cross-site POST is refused before any work is done", async () => {
    const r = await fetch(`${baseUrl()}/api/auth/sign-in`, {
      method: "POST",
      headers: { "content-type": "application/json", origin: "https://elsewhere.test" },
      body: JSON.stringify({ email: "operator@bramblecote.test", password: "coatwright-demo" }),
    });
    expect(r.status).toBe(403);
    expect(r.headers.get("set-cookie")).toBeNull();
  });

  it("error bodies carry no stack trace or SQL", async () => {
    const r = await fetch(`${baseUrl()}/api/auth/sign-in`, { method: "POST", headers: { "content-type": "application/json" }, body: "{\"email\":" });
    const text = await r.text();
    expect(r.status).toBe(400);
    expect(text).not.toMatch(/at \w+ \(|\.ts:\d+|SELECT |sqlite/i);
  });
});
