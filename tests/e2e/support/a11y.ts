import { readFileSync } from "node:fs";
import { createRequire } from "node:module";
import type { Page } from "playwright-core";

/** axe-core's browser build, evaluated in the page (page.evaluate is not subject to the app's CSP). */
const AXE_SOURCE = readFileSync(createRequire(import.meta.url).resolve("axe-core/axe.min.js"), "utf8");

export interface AxeFinding {
  id: string;
  impact: string;
  help: string;
  targets: string[];
}

/**
 * axe-core's WCAG 2.x A/AA rules (and its best practices) on the page as it is now; returns the
 * serious and critical violations, each with the elements it found.
 */
export async function seriousViolations(page: Page): Promise<AxeFinding[]> {
  if (!(await page.evaluate(() => "axe" in window))) await page.evaluate(AXE_SOURCE);
  return page.evaluate(async () => {
    const axe = (window as unknown as { axe: { run: (ctx: Document, options: object) => Promise<{ violations: Array<{ id: string; impact: string | null; help: string; nodes: Array<{ target: string[] }> }> }> } }).axe;
    const result = await axe.run(document, { runOnly: { type: "tag", values: ["wcag2a", "wcag2aa", "wcag21a", "wcag21aa", "wcag22aa", "best-practice"] }, resultTypes: ["violations"] });
    return result.violations
      .filter((v) => v.impact === "serious" || v.impact === "critical")
      .map((v) => ({ id: v.id, impact: v.impact!, help: v.help, targets: v.nodes.slice(0, 5).map((n) => n.target.join(" ")) }));
  });
}

export interface TabWalk {
  /** How the focused elements describe themselves, in Tab order. */
  reached: string[];
  /** Visible, enabled controls that Tab never reached. */
  missed: string[];
  /** Focused elements that showed no focus indicator (no outline or box-shadow on them, or on the label of a visually hidden radio or checkbox). */
  unmarked: string[];
}

/**
 * Presses Tab from the top of the page until focus comes back round (or `maxTabs`), and compares
 * what was focused with every visible control of the page: links, buttons, form fields,
 * summaries and anything with tabindex ≥ 0. Controls of a roving-tabindex group (tabindex −1)
 * and the other buttons of a radio group, reached with the arrow keys once the group has focus,
 * are not expected in the Tab order, nor the content of a closed <details> menu.
 */
export async function walkWithTab(page: Page, maxTabs = 400): Promise<TabWalk> {
  await page.evaluate(() => {
    (document.activeElement as HTMLElement | null)?.blur();
    document.querySelectorAll("[data-tab-seen]").forEach((e) => e.removeAttribute("data-tab-seen"));
  });
  const reached: string[] = [];
  const unmarked: string[] = [];
  let first: string | null = null;
  for (let i = 0; i < maxTabs; i++) {
    await page.keyboard.press("Tab");
    const here = await page.evaluate(() => {
      const el = document.activeElement as HTMLElement | null;
      if (!el || el === document.body) return null;
      const key = el.getAttribute("data-tab-seen") ?? String(document.querySelectorAll("[data-tab-seen]").length + 1);
      el.setAttribute("data-tab-seen", key);
      // WCAG 2.4.7 (focus visible): an outline or a shadow ring on the element, or on the label
      // that stands for a visually hidden input.
      const marked = (e: Element | null) => {
        if (!e) return false;
        const st = getComputedStyle(e);
        return (st.outlineStyle !== "none" && parseFloat(st.outlineWidth) > 0) || st.boxShadow !== "none";
      };
      const visible = marked(el) || ((el as HTMLInputElement).type === "radio" || (el as HTMLInputElement).type === "checkbox" ? marked(el.closest("label")) : false);
      return { text: `${key}:${el.tagName.toLowerCase()} ${(el.getAttribute("aria-label") ?? el.textContent ?? "").trim().slice(0, 40)}`, visible };
    });
    if (here === null) continue;
    if (!here.visible && !unmarked.includes(here.text)) unmarked.push(here.text);
    if (here.text === first) break;
    first ??= here.text;
    reached.push(here.text);
  }
  const missed = await page.evaluate(() => {
    const selector = 'a[href], button, input:not([type="hidden"]), select, textarea, summary, [tabindex]';
    return [...document.querySelectorAll<HTMLElement>(selector)]
      .filter((el) => {
        if (el.hasAttribute("data-tab-seen") || el.tabIndex < 0 || (el as HTMLButtonElement).disabled) return false;
        if (el.closest("[aria-hidden='true'], [inert], [hidden]")) return false;
        // A radio group takes one Tab stop; the arrow keys move within it.
        const radio = el as HTMLInputElement;
        if (radio.type === "radio" && radio.name && document.querySelector(`input[type="radio"][name="${CSS.escape(radio.name)}"][data-tab-seen]`)) return false;
        // Closed <details> (menus) hide their content until opened with Enter on the summary.
        return el.checkVisibility({ visibilityProperty: true, contentVisibilityAuto: true }) && el.getBoundingClientRect().width > 0;
      })
      .map((el) => `${el.tagName.toLowerCase()} ${(el.getAttribute("aria-label") ?? el.textContent ?? (el as HTMLInputElement).name ?? "").trim().slice(0, 60)}`);
  });
  return { reached, missed, unmarked };
}
