// Unknown addresses answer 404 with the app's own not-found page (issue 12: they answered 200).
import { expect, test } from "@playwright/test";

test("an unknown page answers 404 with a way back", async ({ request }) => {
  const res = await request.get("/no-such-page-here");
  expect(res.status()).toBe(404);
  const html = await res.text();
  expect(html).toContain("Nothing here");
  expect(html).toContain('href="/designs"');
});

test("an unknown API path answers 404 too", async ({ request }) => {
  const res = await request.get("/api/no-such-route");
  expect(res.status()).toBe(404);
});
