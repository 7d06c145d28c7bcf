* Measurement script for the reference decks (ngspice control language).
* Run:  ngspice -b -D deck=<deck>.cir -D out=<deck>.meas.txt measure.ctl
* Each deck exports with .csparam: tsw (period), tdead (dead time), tedge (gate edge),
* vin, rl (load), ncyc (simulated cycles), fb (1 = full-bridge inverter), fbr
* (1 = full-bridge rectifier), zvs (1 = measure the ZVS margin; 0 where the node never swings).
* The run goes on a quarter period past ncyc cycles so that no edge falls on its last point;
* every metric is taken over the nwin whole cycles that end at ncyc cycles.
.control
source $deck
set numdgt=10
run
let nwin = 10
let tend = ncyc*tsw
let t0 = tend - nwin*tsw
let tlast = tend - tsw
let ilr = i(vtank)
let vcr = v(n2) - v(pri)
let iabs = abs(ilr)
meas tran vout avg v(out) from=$&t0 to=$&tend
meas tran voutmax max v(out) from=$&t0 to=$&tend
meas tran voutmin min v(out) from=$&t0 to=$&tend
meas tran tankrms rms ilr from=$&t0 to=$&tend
meas tran tankpeak max iabs from=$&t0 to=$&tend
meas tran crpeak max vcr from=$&t0 to=$&tend
meas tran crmin min vcr from=$&t0 to=$&tend
meas tran riprms rms i(vco) from=$&t0 to=$&tend
meas tran capavg avg i(vco) from=$&t0 to=$&tend
* output average over the 10 cycles before the window: a drift check
let tp = t0 - nwin*tsw
meas tran voutprev avg v(out) from=$&tp to=$&t0
* switch currents (switch + body diode + Coss, sensed in the drain): the largest RMS
meas tran sw1rms rms i(vs1) from=$&t0 to=$&tend
meas tran sw2rms rms i(vs2) from=$&t0 to=$&tend
let swrms = sw1rms
if sw2rms > swrms
  let swrms = sw2rms
end
if fb > 0.5
  meas tran sw3rms rms i(vs3) from=$&t0 to=$&tend
  meas tran sw4rms rms i(vs4) from=$&t0 to=$&tend
  if sw3rms > swrms
    let swrms = sw3rms
  end
  if sw4rms > swrms
    let swrms = sw4rms
  end
end
* diode reverse voltage (cathode - anode), the largest over every diode
if fbr > 0.5
  let vr1 = v(out) - v(a1)
  let vr2 = v(a1)
  let vr3 = v(out) - v(sb)
  let vr4 = v(sb)
  meas tran vrd1 max vr1 from=$&t0 to=$&tend
  meas tran vrd2 max vr2 from=$&t0 to=$&tend
  meas tran vrd3 max vr3 from=$&t0 to=$&tend
  meas tran vrd4 max vr4 from=$&t0 to=$&tend
  let diodevr = vrd1
  if vrd2 > diodevr
    let diodevr = vrd2
  end
  if vrd3 > diodevr
    let diodevr = vrd3
  end
  if vrd4 > diodevr
    let diodevr = vrd4
  end
else
  let vr1 = v(out) - v(a1)
  let vr2 = v(out) - v(a2)
  meas tran vrd1 max vr1 from=$&t0 to=$&tend
  meas tran vrd2 max vr2 from=$&t0 to=$&tend
  let diodevr = vrd1
  if vrd2 > diodevr
    let diodevr = vrd2
  end
end
* turn-off current in the last cycle: the high-side group (gate gh) turns off at T/2 - tdead,
* the low-side group (gate gl) at T - tdead (threshold crossings). Positive = the current that
* swings the node towards the incoming switch; the smaller of the two is kept.
let thoff = tlast + tsw/2 - tdead + tedge/2
let tloff = tlast + tsw - tdead + tedge/2
meas tran ihoff find ilr at=$&thoff
meas tran iloff find ilr at=$&tloff
let turnoff = ihoff
if -iloff < turnoff
  let turnoff = -iloff
end
* ZVS margin in the last cycle: gate turn-on instant minus the instant the incoming switch's
* voltage fell to 5 % of vin (leg A; for a full bridge leg B too); the smallest is kept.
if zvs > 0.5
  let thon = tlast + tedge/2
  let tlon = tlast + tsw/2 + tedge/2
  let ths = thon - tsw/2
  let vhi = 0.95*vin
  let vlo = 0.05*vin
  meas tran tza when v(sw)=$&vhi rise=last from=$&ths to=$&thon
  meas tran tzb when v(sw)=$&vlo fall=last from=$&thoff to=$&tlon
  let zvsmargin = thon - tza
  if tlon - tzb < zvsmargin
    let zvsmargin = tlon - tzb
  end
  if fb > 0.5
    meas tran tzc when v(swb)=$&vhi rise=last from=$&thoff to=$&tlon
    meas tran tzd when v(swb)=$&vlo fall=last from=$&ths to=$&thon
    if tlon - tzc < zvsmargin
      let zvsmargin = tlon - tzc
    end
    if thon - tzd < zvsmargin
      let zvsmargin = thon - tzd
    end
  end
else
  let zvsmargin = 0
end
* steady-state proof: charge balance (average capacitor current over the load current),
* the output drift between the last two 10-cycle windows, and the periodicity of the tank
* current and the Cr voltage (largest change between the last two cycles over the peak)
let chargebalance = capavg / (vout / rl)
let drift = (vout - voutprev) / vout
print vout tankrms tankpeak crpeak crmin diodevr swrms turnoff riprms zvsmargin voutmax voutmin > $out
print chargebalance drift >> $out
linearize ilr vcr
let dt = time[1] - time[0]
let m = floor(tsw / dt + 0.5)
let ke = floor((tran1.tend - time[0]) / dt + 0.5)
let ia = ilr[ke - m, ke]
let ib = ilr[ke - 2*m, ke - m]
let va = vcr[ke - m, ke]
let vb = vcr[ke - 2*m, ke - m]
let iperiod = vecmax(abs(ia - ib)) / vecmax(abs(ia))
let vperiod = vecmax(abs(va - vb)) / vecmax(abs(va))
print m iperiod vperiod >> $out
quit
.endc
