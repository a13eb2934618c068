/** One step of the guided reading of a sheet. */
export interface GuideStep {
  title: string;
  /** Plain sentences for a new engineer. */
  text: string[];
}

/**
 * The guided reading of a TCC sheet, step by step, in the order an experienced engineer reads one.
 * `names` are the curves on the current sheet, so the reading points at real things.
 *
 * @example sheetGuideOf({ bands: ['MAIN', 'FDR-MCC'], referenceVoltage: '480 V' })[0].title // 'The two axes'
 */
export function sheetGuideOf(current: {
  bands: string[];
  referenceVoltage: string;
  /** How each band is drawn on the current sheet, e.g. "MAIN: long dash", so the guide points at the drawing. */
  codes?: string[];
}): GuideStep[] {
  const bands = current.bands.length > 0 ? current.bands.join(', ') : 'the devices of the view';
  const codes = current.codes && current.codes.length > 0 ? ` On this sheet: ${current.codes.join('; ')}.` : '';
  return [
    {
      title: 'The two axes',
      text: [
        'Across: current, in amperes, on a logarithmic scale — each major grid line is ten times the one before.',
        'Up: time, in seconds, also logarithmic, from a hundredth of a second to many minutes.',
        `Every current on this sheet is drawn at ${current.referenceVoltage}, the sheet's reference voltage. A device on another voltage is drawn at its current × its voltage ÷ the reference voltage, so currents that flow together line up.`,
      ],
    },
    {
      title: 'A band is what one device does',
      text: [
        `Each shaded band (${bands}) belongs to one protective device. Its left/lower edge is the earliest time the device may operate at that current (minimum melting for a fuse, the fast tolerance edge for a breaker or relay). Its right/upper edge is the latest time by which it will have cleared (total clearing, or the slow edge plus the breaker's interrupting time).`,
        `Left of a band the device never operates: the current is below its pickup. Each band has its own colour and its own edge pattern (solid, long dash, short dash, dash-dot…) and its name is written beside it where it runs, so colour is never the only way to tell them apart.${codes}`,
        'A name with a voltage in brackets, "(12.47 kV)", is a device on another voltage, drawn at its current × its voltage ÷ the reference voltage. Anything the plot has no room to name is listed in the key under the current axis.',
      ],
    },
    {
      title: 'The shape of a band: long-time, short-time, instantaneous',
      text: [
        'A sloping part is inverse-time: more current, faster operation (long-time on a breaker, the inverse curve of a relay, the melting of a fuse).',
        'A flat step is a definite delay (short-time, or a definite-time relay element); a slope inside it marks I²t in.',
        'The drop to the bottom of the sheet is the instantaneous pickup: above that current the device opens as fast as it can.',
      ],
    },
    {
      title: 'Fault lines: how much current can flow',
      text: [
        'The vertical grey lines mark the largest fault current at a bus (and, dash-dotted, the smallest). Each is named in the grey band above the plot, at the bus voltage and, when different, on the sheet’s voltage. A fault beyond the current axis is named at that end of the band with an arrow. Nothing to the right of the maximum can flow there, so a band beyond it never matters for that bus. Each band stops at the largest fault current that flows through its own device (on a phase sheet the larger of the three-phase and line-to-ground faults): a main’s short of its bus’s maximum, since the current of the motors below it does not pass through it. A secondary device’s band on a primary sheet may run past the line through the transformer, which is drawn for the three-phase fault: a line-to-ground fault reaches the primary lines reduced by a Δ–Y unit.',
        'The probe says so when you point beyond the largest fault on the sheet: no such current flows there, so nothing is compared. A device whose band ends before the probe is read but left out of the comparison.',
        'Select a bus or a transformer in the System region to see the fault current worked out in the Work region, every formula and number shown.',
      ],
    },
    {
      title: 'Dashed curves: what equipment can withstand',
      text: [
        'An evenly dashed curve is a withstand ("damage") curve of a transformer or cable, named beside it. The device protecting it should clear to the left of and below it at every current up to the fault level.',
        'A dotted line is a motor’s starting curve; a circle marks transformer inrush and a diamond a motor’s locked rotor. The devices must ride through them: their bands should lie to the right of and above those marks.',
        'A thin dotted vertical line marks a transformer’s full-load current, in its colour; one in a cable’s colour marks the cable’s ampacity (NFPA 70 Table 310.16 at 75 °C, or the ampacity the cable is given): the device above it should be rated no higher, but for the next standard rating NFPA 70 240.4(B) allows — the cable’s ampacity finding says which.',
      ],
    },
    {
      title: 'Two bands in series: selective or not',
      text: [
        'For an upstream device and the one below it, selectivity means the downstream device has cleared before the upstream one can start to operate, with a margin (the coordination time interval).',
        'Where they conflict the sheet hatches only the area between the two edges in question — the upstream device’s earliest operation and the downstream device’s latest clearing — and writes the status and current range beside it: dense vermillion hatching rising to the right is an overlap (both may operate), heavier yellow hatching the other way a thin margin.',
        'Below about 0.01 s (one half-cycle) curves prove nothing: where two instantaneous or current-limiting devices both reach that region it is cross-hatched in grey as not provable from curves — tested selectivity data or an I²t comparison decides there.',
        'When a finding rests on a secondary line-to-line fault across a delta–wye transformer, the primary device’s band is drawn a second time, shifted by 2/√3, with “for a secondary L-L fault” in its name. Ground-fault findings are hatched on a ground-fault sheet, where the ground-fault elements are drawn.',
      ],
    },
    {
      title: 'The probe',
      text: [
        'Move the pointer across the sheet: the vertical line reads every device at that current — earliest operation, latest clearing — and says which clears first and by how much before the next may operate.',
        'Click to pin a probe; pinned probes stay in the row below the sheet and can be exported as CSV. With the keyboard, use “Skip to the sheet” (the first Tab stop) and the left and right arrow keys, Enter to pin.',
      ],
    },
    {
      title: 'Findings',
      text: [
        'The Findings region lists every check: pairs, transformer protection, NEC 450.3 limits, cables and their ampacity, motors, the load each device feeds. Open a finding to read its explanation and what to change; its current range is highlighted on the sheet and its devices are marked.',
        'Select a device in the tree to list only the findings that name it.',
      ],
    },
  ];
}
