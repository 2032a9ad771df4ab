/**
 * The demo engineer's own words in a demo sheet: PS-3 keeps the slab-strip template's text and adds
 * a hand calculation of the façade on its cantilever (invented demo figures, design.md §6), so the
 * demo shows a calculation block, its check and a quantity marked on a figure.
 */

const FACADE_BY_HAND = `# Façade on the cantilever, by hand

The façade along grid A is a precast panel hung from the slab edge. Its weight per square metre is
the panel supplier's figure; the storey height is the podium's. The line load it puts on the edge,
and the moment it gives at the root of the cantilever, are worked out here by hand and checked
against the line load this sheet designs for.

::: calc
h_f = 3.6 m  # Storey height the panel spans
g_f = 2.05 kN/m^2  # Panel weight (supplier's figure)
w_f = h_f * g_f  # Façade line load on the edge, per metre of edge
b_s = 1 m  # Width of the strip this sheet designs
a_f = 2.3 m  # Where the panel hangs, from the last column
M_f = -(w_f * b_s * a_f) to kNm  # Its moment at the cantilever root (hogging, drawn above the axis)
check w_f <= val("input.loads.lines.0.w")  # Façade load within the line load designed for
:::

The façade alone gives :val[calc.M_f] at the root of the cantilever; the moments figure below marks
it against the envelope from all the loads.

::: figure{plot=moments mark=M_f}
Moments from the loads, with the façade's share at the cantilever root worked out by hand.
:::

`

/** PS-3's text: the template's, with the façade worked out by hand before the tendons. */
export function PS3_OWN_TEXT(templateText: string): string {
  const at = templateText.indexOf('# Tendons, cover and eccentricity limits')
  if (at < 0) throw new Error('the slab-strip template has no section "Tendons, cover and eccentricity limits" to put the façade before')
  return templateText.slice(0, at) + FACADE_BY_HAND + templateText.slice(at)
}
