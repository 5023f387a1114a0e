import { expect, type Locator } from "@playwright/test";

/**
 * For each axis title of a nivo chart: its tick labels, and whether the title's box overlaps any
 * of them. nivo draws an axis as a group holding one group per tick (line and label) and the
 * title as a text of its own, so the title's parent is the axis.
 */
export async function axisReadings(chart: Locator, titles: string[]): Promise<{ title: string; ticks: string[]; overlaps: string[] }[]> {
  return chart.locator("svg").first().evaluate((svg, wanted) => {
    const texts = [...svg.querySelectorAll("text")];
    return wanted.map((title) => {
      const legend = texts.find((t) => t.textContent === title);
      if (!legend?.parentElement) return { title, ticks: [], overlaps: [`no axis titled "${title}"`] };
      const box = legend.getBoundingClientRect();
      const tickTexts = [...legend.parentElement.querySelectorAll(":scope > g text")];
      const overlaps = tickTexts
        .filter((t) => {
          const b = t.getBoundingClientRect();
          return b.left < box.right && box.left < b.right && b.top < box.bottom && box.top < b.bottom;
        })
        .map((t) => t.textContent ?? "");
      return { title, ticks: tickTexts.map((t) => t.textContent ?? ""), overlaps };
    });
  }, titles);
}

/** Axis titles clear of their ticks, and each axis in one notation (never "1e6" beside "500,000"). */
export async function expectReadableAxes(chart: Locator, titles: string[]) {
  for (const axis of await axisReadings(chart, titles)) {
    expect(axis.overlaps, `ticks under the title "${axis.title}"`).toEqual([]);
    expect(axis.ticks.length, `ticks of "${axis.title}"`).toBeGreaterThan(1);
    const nonZero = axis.ticks.filter((t) => t !== "0");
    const withExponent = nonZero.filter((t) => /e[+-]?\d/.test(t));
    expect([0, nonZero.length], `one notation on "${axis.title}": ${axis.ticks.join(" | ")}`).toContain(withExponent.length);
  }
}
