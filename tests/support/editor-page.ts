/** Page objects of the linkage editor for browser tests: open it, wait until saved, drop a part, connect two ports, open a joint. */
import { expect } from "vitest";
import type { Locator, Page } from "playwright-core";

export const canvas = (p: Page) => p.getByTestId("canvas");
export const saveStatus = (p: Page) => p.getByTestId("save-status");

/** Go to an editor URL and wait until the canvas has placed its parts. */
export async function openEditor(p: Page, url: string) {
  await p.goto(url);
  await p.getByTestId("linkage-editor").waitFor({ timeout: 60_000 });
  await p.waitForSelector("[data-testid=canvas][data-view=ready]", { timeout: 10_000 });
}

/** Wait until the autosave reports every change saved. */
export async function waitSaved(p: Page) {
  await p.waitForFunction(() => document.querySelector("[data-testid=save-status]")?.getAttribute("data-status") === "saved", null, { timeout: 15_000 });
}

/** Drag a kind from the parts tray and drop it at a point of the canvas; returns the new part's id. */
export async function dropPart(p: Page, kind: string, x: number, y: number): Promise<string> {
  const before = await p.locator(".react-flow__node").count();
  await p.getByTestId(`tray-${kind}`).dragTo(canvas(p), { targetPosition: { x, y } });
  await expect.poll(() => p.locator(".react-flow__node").count()).toBe(before + 1);
  const id = await p.locator(".react-flow__node").nth(before).getAttribute("data-id");
  return id!;
}

export async function centre(l: Locator) {
  const b = await l.boundingBox();
  if (!b) throw new Error("not on screen");
  return { x: b.x + b.width / 2, y: b.y + b.height / 2 };
}

/** Press on one port, move to the other, let go — as a person connects two parts. */
export async function connect(p: Page, from: [string, string], to: [string, string]) {
  const before = await p.locator(".react-flow__edge").count();
  const a = await centre(p.getByTestId(`port-${from[0]}-${from[1]}`));
  const b = await centre(p.getByTestId(`port-${to[0]}-${to[1]}`));
  await p.mouse.move(a.x, a.y);
  await p.mouse.down();
  await p.mouse.move((a.x + b.x) / 2, (a.y + b.y) / 2 + 10, { steps: 6 });
  await p.mouse.move(b.x, b.y, { steps: 6 });
  await p.mouse.up();
  await expect.poll(() => p.locator(".react-flow__edge").count()).toBe(before + 1);
}

/** Select a joint by its badge on the canvas and wait for its card; returns the card. */
export async function openJoint(p: Page, jointId: string) {
  await p.getByTestId(`joint-${jointId}`).click();
  const card = p.getByTestId("joint-card");
  await card.waitFor();
  return card;
}

/** Select a part by clicking it on the canvas and wait for its card; returns the card. */
export async function openPart(p: Page, nodeId: string) {
  await p.getByTestId(`node-${nodeId}`).click();
  const card = p.getByTestId("node-form-panel");
  await card.waitFor();
  return card;
}
