// Sign-in, navigation per role, refusals, and the invite round trip, as a person would do them.
import { ACCOUNTS, VIEWPORTS, assert, screenshot, signIn } from "../harness.mjs";

const NAV_BY_ROLE = {
  viewer: ["Overview", "Registry"],
  researcher: ["Overview", "Submit", "Design", "Batches", "Registry"],
  curator: ["Overview", "Submit", "Design", "Batches", "Registry", "Review"],
  admin: ["Overview", "Submit", "Design", "Batches", "Registry", "Review", "Admin"],
};

async function navLabels(page) {
  return (await page.getByRole("navigation", { name: "Main" }).getByRole("link").allTextContents()).map((s) => s.trim());
}

export const tests = [
  {
    name: "sign-in page renders at desktop and phone sizes",
    async run({ newPage, baseUrl }) {
      for (const [size, viewport] of Object.entries(VIEWPORTS)) {
        const page = await newPage(viewport);
        await page.goto(`${baseUrl}/signin`);
        assert(await page.getByRole("button", { name: "Sign in" }).isVisible(), "no sign-in button");
        await screenshot(page, `signin-${size}`);
      }
    },
  },
  {
    name: "signed out, a workspace page redirects to sign-in and the API answers 401",
    async run({ newPage, baseUrl }) {
      const page = await newPage();
      await page.goto(`${baseUrl}/overview`);
      assert(page.url().startsWith(`${baseUrl}/signin`), `expected sign-in, got ${page.url()}`);
      const res = await fetch(`${baseUrl}/api/users`);
      assert(res.status === 401, `expected 401, got ${res.status}`);
      assert((await res.json()).error === "not signed in", "401 body");
    },
  },
  {
    name: "a wrong password is refused with a message",
    async run({ newPage, baseUrl }) {
      const page = await newPage();
      await page.goto(`${baseUrl}/signin`);
      await page.getByLabel("E-mail").fill(ACCOUNTS.viewer);
      await page.getByLabel("Password").fill("not-the-password");
      await page.getByRole("button", { name: "Sign in" }).click();
      const alert = page.locator("#signin-error");
      await alert.waitFor();
      assert((await alert.textContent()).includes("wrong"), "no error message");
    },
  },
  ...Object.entries(NAV_BY_ROLE).map(([role, expected]) => ({
    name: `${role} signs in and sees exactly their navigation`,
    async run({ newPage, baseUrl }) {
      for (const [size, viewport] of Object.entries(VIEWPORTS)) {
        const page = await newPage(viewport);
        await signIn(page, baseUrl, role);
        const labels = await navLabels(page);
        assert(JSON.stringify(labels) === JSON.stringify(expected), `${role} nav: ${labels.join(", ")}`);
        await screenshot(page, `shell-${role}-${size}`);
      }
    },
  })),
  {
    name: "a viewer is refused the admin page and the admin API (403)",
    async run({ newPage, baseUrl }) {
      const page = await newPage();
      await signIn(page, baseUrl, "viewer");
      await page.goto(`${baseUrl}/admin/users`);
      assert((await page.getByRole("main").getByRole("alert").textContent()).includes("admin"), "no refusal shown");
      const status = await page.evaluate(async () => (await fetch("/api/users")).status);
      assert(status === 403, `expected 403, got ${status}`);
      await page.goto(`${baseUrl}/review`);
      assert((await page.getByRole("main").getByRole("alert").textContent()).includes("curator"), "review not refused");
    },
  },
  {
    name: "an admin invites a user; the mail is in the outbox; the invitee sets a password and signs in",
    async run({ newPage, baseUrl }) {
      const admin = await newPage();
      await signIn(admin, baseUrl, "admin");
      await admin.goto(`${baseUrl}/admin/users`);
      const form = admin.getByRole("form", { name: "Invite a user" });
      await form.getByLabel("E-mail").fill("tamsin.new@wavesieve.test");
      await form.getByLabel("Name").fill("Tamsin New");
      await form.getByLabel("Role").selectOption("researcher");
      await form.getByRole("button", { name: "Invite" }).click();
      await admin.getByText("Invitation sent").waitFor();
      await admin.getByText("tamsin.new@wavesieve.test").first().waitFor();
      await screenshot(admin, "admin-users-desktop");

      let text = "";
      for (let i = 0; i < 20 && !text.includes("tamsin.new"); i++) {
        await admin.goto(`${baseUrl}/admin/outbox`);
        text = (await admin.getByRole("main").textContent()) ?? "";
        if (!text.includes("tamsin.new")) await admin.waitForTimeout(250);
      }
      assert(text.includes("You are invited to Wavesieve"), "invite mail not in outbox");
      await screenshot(admin, "admin-outbox-desktop");
      const link = /http:\/\/localhost:\d+\/welcome\/[A-Za-z0-9_-]+/.exec(text)?.[0];
      assert(link, "no link in mail");

      const invitee = await newPage();
      await invitee.goto(link);
      await invitee.getByLabel("New password").fill("tamsin-password-1");
      await invitee.getByLabel("Repeat it").fill("tamsin-password-1");
      await invitee.getByRole("button", { name: "Set password" }).click();
      await invitee.getByText("Password set").waitFor();
      await invitee.goto(`${baseUrl}/signin`);
      await invitee.getByLabel("E-mail").fill("tamsin.new@wavesieve.test");
      await invitee.getByLabel("Password").fill("tamsin-password-1");
      await invitee.getByRole("button", { name: "Sign in" }).click();
      await invitee.waitForURL(`${baseUrl}/overview`);
      const labels = await navLabels(invitee);
      assert(labels.includes("Submit") && !labels.includes("Admin"), `invitee nav: ${labels}`);
    },
  },
  {
    name: "web hygiene: security headers, session cookie flags, no stack traces, failed sign-ins throttled",
    async run({ newPage, baseUrl }) {
      const res = await fetch(`${baseUrl}/signin`);
      assert(res.headers.get("x-content-type-options") === "nosniff", "nosniff header");
      assert(res.headers.get("x-frame-options") === "DENY", "frame header");
      assert(res.headers.get("referrer-policy") === "same-origin", "referrer policy");
      assert(!res.headers.get("x-powered-by"), "x-powered-by leaks");

      const page = await newPage();
      await signIn(page, baseUrl, "viewer");
      const cookie = (await page.context().cookies()).find((c) => c.name.includes("session-token"));
      assert(cookie && cookie.httpOnly && cookie.sameSite === "Lax", `session cookie flags: ${JSON.stringify(cookie)}`);

      const bad = await fetch(`${baseUrl}/api/batches`, { method: "POST", headers: { cookie: `${cookie.name}=${cookie.value}`, "content-type": "application/json" }, body: "{not json" });
      const text = await bad.text();
      assert(bad.status >= 400 && bad.status < 500 && !/at \S+ \(|node_modules/.test(text), `error body leaks internals: ${bad.status} ${text.slice(0, 200)}`);

      // Failed sign-ins from one (pretend) client address: the 21st within a minute is refused.
      const from = { "x-forwarded-for": "198.51.100.7", "content-type": "application/x-www-form-urlencoded" };
      const attempt = () => fetch(`${baseUrl}/api/auth/callback/credentials`, { method: "POST", headers: from, body: "email=viewer%40wavesieve.test&password=wrong&json=true", redirect: "manual" });
      for (let i = 0; i < 20; i++) assert((await attempt()).status !== 429, `throttled too early at attempt ${i + 1}`);
      assert((await attempt()).status === 429, "21st failed sign-in not throttled");
    },
  },
];
