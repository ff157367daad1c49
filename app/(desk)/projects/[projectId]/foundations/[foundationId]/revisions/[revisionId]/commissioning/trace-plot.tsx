"use client";

import { useMemo } from "react";
import type { TracePlot as TracePlotData } from "@/modules/desk/measurement-view";
import { UnitsProvider, useUnits, type UnitSystem } from "@/app/_components/workspace/units-context";
import { FrequencyMarks, MODE_COLOUR, type FrequencyBand, type ModeMark, type OperatingBand } from "@/app/_components/workspace/plot-marks";
import { FrequencyLineChart, type FrequencyLayer, type FrequencySeries } from "@/app/_components/workspace/frequency-line-chart";

// Measured in brick, predicted in slate: the measured curve is the one the reader checks.
const colours = ["#b8432f", "#647d88"];
const MEASURED_COLOUR = "#b8432f";

function marksLayer(operating: OperatingBand[], soil: FrequencyBand[], modes: ModeMark[]): FrequencyLayer {
  function MarksLayer({ xScale, innerWidth, innerHeight }: Parameters<FrequencyLayer>[0]) {
    return <FrequencyMarks x={(v) => xScale(v as never)} innerWidth={innerWidth} innerHeight={innerHeight} operating={operating} soil={soil} modes={modes} idPrefix="trace" />;
  }
  return MarksLayer;
}

interface Props {
  plot: TracePlotData;
  /** The revision's natural frequencies (Hz) and the same across the soil band. */
  naturalHz: number[];
  soilBands: FrequencyBand[];
  operating: OperatingBand[];
  resonancesHz: number[];
}

function Plot({ plot, naturalHz, soilBands, operating, resonancesHz }: Props) {
  const u = useUnits();
  const series: FrequencySeries[] = [
    { id: "measured", data: plot.measured.map((p) => ({ x: p.hz, y: u.toDisplayNumber(plot.kind, p.value) })) },
    { id: "predicted", data: plot.predicted.map((p) => ({ x: p.hz, y: u.toDisplayNumber(plot.kind, p.value) })) },
  ];
  const modes = useMemo<ModeMark[]>(
    () => [
      ...naturalHz.map((hz, i) => ({ hz, label: `f${i + 1}`, title: `predicted natural frequency ${i + 1}`, colour: MODE_COLOUR })),
      ...resonancesHz.map((hz, i) => ({ hz, label: resonancesHz.length > 1 ? `measured ${i + 1}` : "measured", title: "measured resonance", colour: MEASURED_COLOUR })),
    ],
    [naturalHz, resonancesHz],
  );
  const layer = useMemo(() => marksLayer(operating, soilBands, modes), [operating, soilBands, modes]);
  return (
    <div className="space-y-2">
      <div className="flex flex-wrap gap-3 text-2xs text-basalt-500">
        <span>
          <span className="inline-block h-0.5 w-4 align-middle" style={{ background: colours[0] }} /> measured ({plot.location} {plot.direction})
        </span>
        <span>
          <span className="inline-block h-0.5 w-4 align-middle" style={{ background: colours[1] }} /> predicted: {plot.predictedLabel}
        </span>
        <span>
          <span className="inline-block w-4 border-t border-dashed border-basalt-500 align-middle" /> predicted natural frequencies; the measured resonance dashed in the measured colour
        </span>
        <span>
          <span className="inline-block h-2 w-4 bg-basalt-200 align-middle" /> natural frequencies across the soil band
        </span>
      </div>
      <div className="h-72 w-full" data-testid="trace-plot">
        <FrequencyLineChart series={series} colours={colours} yLabel={`${plot.basis} (${u.unitLabel(plot.kind)})`} ariaLabel="Run-up trace measured, over the predicted frequency response" layer={layer} />
      </div>
    </div>
  );
}

/** A run-up trace over the revision's predicted frequency response (the desk's one chart). */
export function TracePlot(props: Props & { units: UnitSystem }) {
  return (
    <UnitsProvider initial={props.units}>
      <Plot {...props} />
    </UnitsProvider>
  );
}
