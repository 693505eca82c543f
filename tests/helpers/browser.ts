// Debian's chromium driven by playwright-core (never a downloaded browser).
import { chromium, type Browser, type BrowserContext, type Page } from "playwright-core";
import { BASE_URL } from "./server";

const ARGS = [
  "--headless",
  "--no-sandbox",
  "--disable-gpu",
  "--disable-quic",
  "--no-first-run",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
];

export async function launch(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    // playwright gives each launch a fresh temporary profile of its own.
    args: ARGS,
  });
}

export async function newContext(browser: Browser, opts: { mobile?: boolean } = {}): Promise<BrowserContext> {
  return browser.newContext({
    baseURL: BASE_URL,
    acceptDownloads: true,
    viewport: opts.mobile ? { width: 390, height: 844 } : { width: 1366, height: 900 },
  });
}

/** Page object for the sign-in screen. */
export class SignInPage {
  constructor(readonly page: Page) {}

  async signIn(email: string, password: string) {
    await this.page.goto("/sign-in");
    await this.page.getByLabel("E-mail").fill(email);
    await this.page.getByLabel("Password").fill(password);
    await this.page.getByRole("button", { name: "Sign in" }).click();
  }

  async signedInAs(): Promise<string> {
    return (await this.page.getByTestId("signed-in-as").textContent({ timeout: 20_000 })) ?? "";
  }
}

export async function signInAs(
  browser: Browser,
  email: string,
  password: string,
  opts: { mobile?: boolean } = {},
) {
  const context = await newContext(browser, opts);
  const page = await context.newPage();
  const signIn = new SignInPage(page);
  await signIn.signIn(email, password);
  await page.getByTestId("signed-in-as").waitFor({ timeout: 30_000 });
  return { context, page };
}
