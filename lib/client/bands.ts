/** How a band reads on every screen: "± 10 %", "exact", "± 1.5 % of …", or that none is stated. */
export const percent = (x: number) => `${Number((x * 100).toPrecision(2))} %`;

export function bandText(band: { rel: number | null; approximates?: string } | null | undefined): string {
  if (band === undefined) return '';
  if (band === null || band.rel === null) return 'none stated';
  if (band.rel === 0) return 'exact';
  return band.approximates ? `± ${percent(band.rel)} of ${band.approximates}` : `± ${percent(band.rel)}`;
}
