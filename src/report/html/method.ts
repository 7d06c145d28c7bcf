/** Method and limits section: static text (no results data). */

/** Section body: how the numbers are made, where FHA fails, sources and the safety caution. */
export function renderMethod(): string {
  return `<p>FHA (first-harmonic approximation) replaces the bridge by the fundamental of its square wave and the rectifier with its output capacitor by an equivalent AC resistance R<sub>ac</sub> = 8 n² V<sub>rect</sub> / (π² I<sub>o</sub>), with the diode drop in V<sub>rect</sub>. The tank then is a linear circuit: gain, currents, capacitor voltage and the zero-phase (inductive/capacitive) boundary follow in closed form. Each corner is also simulated in SPICE until the output settles, and the same quantities are measured from the last whole cycles.</p>
<ul>
<li><b>Below resonance</b> (fs &lt; fr) the rectifier current has gaps (O intervals in which Lm joins the resonance): the real gain is higher than FHA, and the magnetizing and switch turn-off currents differ most.</li>
<li><b>Above resonance</b> the primary edge truncates the secondary current: the real gain is lower than FHA, and rectifier commutation is hard (no ZCS).</li>
<li>FHA ignores dead time, switch and diode drops and parasitic capacitances; at very light load above resonance parasitic capacitance dominates, and FHA peak-gain values are not safe limits.</li>
<li>Agreement is expected to be close near fs = fr, where the gain is 1 for every load; a large gap there points at the model or the design data rather than at FHA.</li>
</ul>
<p class="refs">Sources: R. W. Erickson and D. Maksimović, <i>Fundamentals of Power Electronics</i>, 2nd ed., ch. 19 (resonant conversion); R. L. Steigerwald, “A comparison of half-bridge resonant converter topologies”, IEEE Transactions on Power Electronics, 1988; X. Fang, H. Hu, Z. J. Shen and I. Batarseh, “Operation mode analysis and peak gain approximation of the LLC resonant converter”, IEEE Transactions on Power Electronics, 2012.</p>
<p class="caution"><strong>Safety.</strong> This report models mains-voltage hardware. Simulation does not replace bench validation or a safety review: build and test with qualified people, and defer to local codes, the applicable safety standards and licensed practice.</p>`;
}
