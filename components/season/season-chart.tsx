import { scaleLinear, scaleTime } from 'd3-scale';
import { line as d3line } from 'd3-shape';
import { useMemo, type ReactNode } from 'react';
import { View, type GestureResponderEvent } from 'react-native';
import Svg, { Circle, G, Line, Path, Polygon, Rect, Text as SvgText } from 'react-native-svg';
import { useTheme } from '@/components/theme/use-theme';
import { Text } from '@/components/ui/text';
import type { HiveSeason, SeasonReferences } from '@/shared/schemas/season';

/** A mark on a chart that stands for a record: tapping or hovering near it selects the record. */
export interface ChartMark {
  id: string;
  /** Epoch ms on the time axis. */
  t: number;
}

export interface SeasonChartProps {
  hive: HiveSeason;
  /** The season's range, ISO instants. */
  from: string;
  to: string;
  references: SeasonReferences;
  /** Drawing width in px (the charts are redrawn to the space they get). */
  width: number;
  selectedId?: string | null;
  onSelect?: (recordId: string) => void;
  /** Small multiples on the apiary review: frames and mites only, shorter panels. */
  compact?: boolean;
  /** The time axis, epoch ms; small multiples share one so hives line up. Default: this hive's months. */
  domain?: [number, number];
  /** Write the legend under the panels (small multiples write it once). */
  legend?: boolean;
  /** Words for the selected record ("3 Jun · Quick check"), written beside the selection rule. */
  selectedLabel?: string;
}

const PAD_LEFT = 48;
const PAD_RIGHT = 16;
const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

/** Every record mark of a hive's season, in time order: what a tap or hover can land on. */
export function marksOf(hive: HiveSeason): ChartMark[] {
  const ms = (iso: string) => Date.parse(iso);
  return [
    ...hive.inspections.map((r) => ({ id: r.id, t: ms(r.at) })),
    ...hive.feedings.map((r) => ({ id: r.id, t: ms(r.at) })),
    ...hive.harvests.map((r) => ({ id: r.id, t: ms(r.at) })),
    ...hive.miteCounts.map((r) => ({ id: r.id, t: ms(r.at) })),
    ...hive.treatments.map((r) => ({ id: r.id, t: ms(r.start) })),
  ].sort((a, b) => a.t - b.t);
}

const DAY_MS = 86_400_000;

/**
 * The months the charts span: from the month of the first record or reading to the month of
 * the last, inside the season; the whole season when there is nothing. Empty winter months would
 * only squeeze the months that matter.
 */
export function dataMonths(hive: HiveSeason, marks: readonly ChartMark[], from: string, to: string): [number, number] {
  const lo = Date.parse(from);
  const hi = Date.parse(to);
  const times = [...marks.map((m) => m.t), ...hive.treatments.map((tr) => Date.parse(tr.end) - DAY_MS)];
  const pts = hive.sensors?.points ?? [];
  if (pts.length) times.push(Date.parse(pts[0].t), Date.parse(pts[pts.length - 1].t));
  if (times.length === 0) return [lo, hi];
  const first = new Date(Math.max(lo, Math.min(...times)));
  const last = new Date(Math.min(hi - 1, Math.max(...times)));
  const start = Date.UTC(first.getUTCFullYear(), first.getUTCMonth(), 1);
  const end = Date.UTC(last.getUTCFullYear(), last.getUTCMonth() + 1, 1);
  return [start, Math.min(hi, end)];
}

/** The mark nearest in time to `t`, or null when there are none. */
export function nearestMark(marks: readonly ChartMark[], t: number): ChartMark | null {
  let best: ChartMark | null = null;
  for (const m of marks) if (!best || Math.abs(m.t - t) < Math.abs(best.t - t)) best = m;
  return best;
}

/**
 * A hive's season as stacked panels on one time axis, drawn with react-native-svg from d3
 * scales and line generators: frames of brood and bees; honey stores with feedings and harvests;
 * mites per 100 bees against the 3 per 100 threshold with treatments as spans; and, when the
 * hive has a logger, brood-nest temperature against the 33–36 °C band and weight with each
 * day's gain or loss. Quick checks are ticks on every panel's axis. Shapes and words, not
 * colour alone, tell the series apart. The whole chart is one big target: a tap (or, with a
 * mouse, hovering) selects the nearest record.
 */
export function SeasonChart({ hive, from, to, references, width, selectedId, onSelect, compact = false, domain, legend = true, selectedLabel }: SeasonChartProps) {
  const t = useTheme();
  const c = t.colours;
  const w = Math.max(280, Math.round(width));
  const marks = useMemo(() => marksOf(hive), [hive]);
  const own = useMemo(() => dataMonths(hive, marks, from, to), [hive, marks, from, to]);
  const [x0, x1] = domain ?? own;
  const x = useMemo(() => scaleTime<number, number>().domain([new Date(x0), new Date(x1)]).range([PAD_LEFT, w - PAD_RIGHT]), [x0, x1, w]);
  const panelH = compact ? 110 : 150;
  const font = { fontFamily: t.fontFamily.regular, fontSize: 14 };
  const bold = { fontFamily: t.fontFamily.bold, fontSize: 15 };
  const ms = (iso: string) => Date.parse(iso);

  const selectedT = selectedId ? marks.find((m) => m.id === selectedId)?.t ?? null : null;

  const panels: { key: string; title: string; legend: string; height: number; draw: (y0: number, h: number) => ReactNode }[] = [];

  const monthTicks = (y0: number, h: number, labels: boolean) => {
    const start = new Date(x0);
    const end = x1;
    const out: ReactNode[] = [];
    for (let d = new Date(Date.UTC(start.getUTCFullYear(), start.getUTCMonth(), 1)); d.getTime() <= end; d = new Date(Date.UTC(d.getUTCFullYear(), d.getUTCMonth() + 1, 1))) {
      const px = x(d);
      out.push(<Line key={`g${d.getTime()}`} x1={px} x2={px} y1={y0} y2={y0 + h} stroke={c.sunk} strokeWidth={1} />);
      const mid = x(new Date(Date.UTC(d.getUTCFullYear(), d.getUTCMonth(), 15)));
      if (labels && mid < w - PAD_RIGHT && (!compact || d.getUTCMonth() % 2 === 0)) {
        out.push(
          <SvgText key={`m${d.getTime()}`} x={mid} y={y0 + h + 16} textAnchor="middle" fill={c.inkMuted} {...font}>
            {MONTHS[d.getUTCMonth()]}
          </SvgText>,
        );
      }
    }
    return out;
  };

  const inspectionTicks = (y0: number, h: number) =>
    hive.inspections.map((r) => (
      <Line key={`tick-${r.id}`} testID="season-inspection-tick" x1={x(new Date(r.at))} x2={x(new Date(r.at))} y1={y0 + h - 8} y2={y0 + h} stroke={c.ink} strokeWidth={2} />
    ));

  const yAxis = (y: (v: number) => number, ticks: number[], unit: string) =>
    ticks.map((v) => (
      <SvgText key={`y${unit}${v}`} x={PAD_LEFT - 6} y={y(v) + 5} textAnchor="end" fill={c.inkMuted} {...font}>
        {`${v}`}
      </SvgText>
    ));

  // 1. Frames of brood and of bees.
  {
    const maxFrames = Math.max(10, ...hive.inspections.map((r) => Math.max(r.framesBees, r.framesBrood)));
    panels.push({
      key: 'frames',
      title: 'Frames of brood and bees',
      legend: '● brood (solid line)   □ bees (dashed)   | Quick check',
      height: panelH,
      draw: (y0, h) => {
        const y = scaleLinear().domain([0, maxFrames]).range([y0 + h, y0 + 8]).nice();
        const pts = hive.inspections.map((r) => ({ t: ms(r.at), brood: r.framesBrood, bees: r.framesBees }));
        const broodPath = d3line<(typeof pts)[number]>().x((p) => x(new Date(p.t))).y((p) => y(p.brood))(pts);
        const beesPath = d3line<(typeof pts)[number]>().x((p) => x(new Date(p.t))).y((p) => y(p.bees))(pts);
        return (
          <>
            {yAxis(y, y.ticks(compact ? 2 : 3), 'f')}
            {beesPath ? <Path testID="season-bees-line" d={beesPath} stroke={c.inkMuted} strokeWidth={2} strokeDasharray="6 4" fill="none" /> : null}
            {broodPath ? <Path testID="season-brood-line" d={broodPath} stroke={c.green} strokeWidth={3} fill="none" /> : null}
            {pts.map((p, i) => (
              <G key={`fp${i}`}>
                <Rect testID="season-bees-point" x={x(new Date(p.t)) - 4} y={y(p.bees) - 4} width={8} height={8} fill={c.surface} stroke={c.ink} strokeWidth={2} />
                <Circle testID="season-brood-point" cx={x(new Date(p.t))} cy={y(p.brood)} r={5} fill={c.green} stroke={c.ink} strokeWidth={1} />
              </G>
            ))}
          </>
        );
      },
    });
  }

  // 2. Honey stores, with feedings and harvests as markers.
  if (!compact) {
    const maxKg = Math.max(10, ...hive.inspections.map((r) => r.storesKg));
    panels.push({
      key: 'stores',
      title: 'Honey stores, kg',
      legend: `◆ stores from honey frames (${hive.honeyFrameSize} frames, TRADE-REFERENCES §6)   ▲ feeding   ■ harvest`,
      height: panelH,
      draw: (y0, h) => {
        const y = scaleLinear().domain([0, maxKg]).range([y0 + h, y0 + 24]).nice();
        const pts = hive.inspections.map((r) => ({ t: ms(r.at), kg: r.storesKg }));
        const path = d3line<(typeof pts)[number]>().x((p) => x(new Date(p.t))).y((p) => y(p.kg))(pts);
        return (
          <>
            {yAxis(y, y.ticks(3), 's')}
            {path ? <Path testID="season-stores-line" d={path} stroke={c.ink} strokeWidth={2} fill="none" /> : null}
            {pts.map((p, i) => {
              const px = x(new Date(p.t));
              const py = y(p.kg);
              return <Polygon key={`sp${i}`} testID="season-stores-point" points={`${px},${py - 6} ${px + 6},${py} ${px},${py + 6} ${px - 6},${py}`} fill={c.ink} />;
            })}
            {hive.feedings.map((f) => {
              const px = x(new Date(f.at));
              const py = y0 + 6;
              return <Polygon key={f.id} testID="season-feeding-marker" points={`${px},${py} ${px + 7},${py + 12} ${px - 7},${py + 12}`} fill={c.green} stroke={c.ink} strokeWidth={1} />;
            })}
            {hive.harvests.map((hv) => (
              <Rect key={hv.id} testID="season-harvest-marker" x={x(new Date(hv.at)) - 6} y={y0 + 6} width={12} height={12} fill={c.ink} />
            ))}
          </>
        );
      },
    });
  }

  // 3. Mites per 100 bees against the threshold, treatments as spans.
  {
    const washes = hive.miteCounts.filter((m) => m.perHundredBees != null);
    const threshold = references.miteThresholdPerHundred;
    const maxMites = Math.max(threshold * 2, ...washes.map((m) => m.perHundredBees as number));
    panels.push({
      key: 'mites',
      title: 'Mites per 100 bees',
      legend: `○ wash or roll   ▭ treatment   shaded: at or above ${threshold} per 100 bees, treat (${references.miteThresholdSource})`,
      height: panelH,
      draw: (y0, h) => {
        const spanH = 18;
        const y = scaleLinear().domain([0, maxMites]).range([y0 + h - spanH - 4, y0 + 8]).nice();
        const pts = washes.map((m) => ({ t: ms(m.at), v: m.perHundredBees as number }));
        const path = d3line<(typeof pts)[number]>().x((p) => x(new Date(p.t))).y((p) => y(p.v))(pts);
        return (
          <>
            <G testID="season-mite-threshold">
              <Rect x={PAD_LEFT} y={y(y.domain()[1])} width={w - PAD_LEFT - PAD_RIGHT} height={y(threshold) - y(y.domain()[1])} fill={c.redTint} />
              <Line x1={PAD_LEFT} x2={w - PAD_RIGHT} y1={y(threshold)} y2={y(threshold)} stroke={c.red} strokeWidth={2} strokeDasharray="8 4" />
              <SvgText x={PAD_LEFT + 6} y={y(threshold) - 6} fill={c.red} {...font}>
                {`${threshold} per 100 bees — treat (${references.miteThresholdSource})`}
              </SvgText>
            </G>
            {yAxis(y, y.ticks(compact ? 2 : 3), 'm')}
            {hive.treatments.map((tr) => {
              const x1 = Math.max(PAD_LEFT, x(new Date(tr.start)));
              const x2 = Math.min(w - PAD_RIGHT, x(new Date(tr.end)));
              return (
                <G key={tr.id} testID="season-treatment-span">
                  <Rect x={x1} y={y0 + h - spanH} width={Math.max(4, x2 - x1)} height={spanH - 2} fill={c.sunk} stroke={c.ink} strokeWidth={2} strokeDasharray={tr.ended ? undefined : '4 3'} />
                  {x2 - x1 > 70 ? (
                    <SvgText x={x1 + 4} y={y0 + h - 5} fill={c.ink} {...font} fontSize={13}>
                      {tr.activeIngredient.replace(/-/g, ' ')}
                    </SvgText>
                  ) : null}
                </G>
              );
            })}
            {path ? <Path d={path} stroke={c.ink} strokeWidth={2} fill="none" /> : null}
            {pts.map((p, i) => (
              <Circle key={`mp${i}`} testID="season-mite-point" cx={x(new Date(p.t))} cy={y(p.v)} r={6} fill={p.v >= threshold ? c.red : c.surface} stroke={c.ink} strokeWidth={2} />
            ))}
          </>
        );
      },
    });
  }

  // 4. Sensor traces.
  const sensors = hive.sensors;
  if (sensors && !compact) {
    const temps = sensors.points.filter((p) => p.temperatureC != null);
    if (temps.length > 1) {
      const lo = Math.min(references.broodNestLowC - 3, ...temps.map((p) => p.temperatureC as number));
      const hi = Math.max(references.broodNestHighC + 1, ...temps.map((p) => p.temperatureC as number));
      panels.push({
        key: 'temperature',
        title: 'Brood-nest temperature, °C',
        legend: `shaded: brood nest ${references.broodNestLowC}–${references.broodNestHighC} °C (${references.broodNestSource})`,
        height: panelH,
        draw: (y0, h) => {
          const y = scaleLinear().domain([lo, hi]).range([y0 + h, y0 + 8]).nice();
          const path = d3line<(typeof temps)[number]>()
            .defined((p) => p.temperatureC != null)
            .x((p) => x(new Date(p.t)))
            .y((p) => y(p.temperatureC as number))(temps);
          return (
            <>
              <G testID="season-brood-nest-band">
                <Rect x={PAD_LEFT} y={y(references.broodNestHighC)} width={w - PAD_LEFT - PAD_RIGHT} height={y(references.broodNestLowC) - y(references.broodNestHighC)} fill={c.greenTint} />
                <SvgText x={PAD_LEFT + 6} y={y(references.broodNestHighC) - 4} fill={c.green} {...font}>
                  {`${references.broodNestLowC}–${references.broodNestHighC} °C brood nest (${references.broodNestSource})`}
                </SvgText>
              </G>
              {yAxis(y, y.ticks(3), 't')}
              {path ? <Path testID="season-temperature-trace" d={path} stroke={c.ink} strokeWidth={1.5} fill="none" /> : null}
            </>
          );
        },
      });
    }
    const weights = sensors.points.filter((p) => p.weightKg != null);
    if (weights.length > 1) {
      const lo = Math.min(...weights.map((p) => p.weightKg as number));
      const hi = Math.max(...weights.map((p) => p.weightKg as number));
      const maxDelta = Math.max(0.5, ...sensors.weightDays.map((d) => Math.abs(d.deltaKg)));
      panels.push({
        key: 'weight',
        title: 'Hive weight, kg, and each day’s change',
        legend: `▮ up: gaining   ▮ down: losing   – flat (${references.weightDaySource})`,
        height: panelH + 50,
        draw: (y0, h) => {
          const stripH = 44;
          const y = scaleLinear().domain([lo - 1, hi + 1]).range([y0 + h - stripH - 8, y0 + 8]).nice();
          const path = d3line<(typeof weights)[number]>()
            .x((p) => x(new Date(p.t)))
            .y((p) => y(p.weightKg as number))(weights);
          const mid = y0 + h - stripH / 2;
          // Bars scale to 1 kg a day; a bigger change (a harvest not recorded) is drawn at full height.
          const dy = scaleLinear().domain([0, Math.min(maxDelta, 1)]).range([0, stripH / 2 - 2]).clamp(true);
          const dayW = Math.max(1, x(new Date(x0 + 86_400_000)) - x(new Date(x0)) - 0.5);
          return (
            <>
              {yAxis(y, y.ticks(3), 'w')}
              {path ? <Path testID="season-weight-trace" d={path} stroke={c.ink} strokeWidth={1.5} fill="none" /> : null}
              <Line x1={PAD_LEFT} x2={w - PAD_RIGHT} y1={mid} y2={mid} stroke={c.line} strokeWidth={1} />
              {sensors.weightDays.map((d) => {
                const px = x(new Date(`${d.date}T12:00:00Z`)) - dayW / 2;
                if (d.trend === 'flat') return <Rect key={d.date} testID="season-weight-day-flat" x={px} y={mid - 1} width={dayW} height={2} fill={c.inkMuted} />;
                const hgt = Math.max(2, dy(Math.abs(d.deltaKg)));
                return d.trend === 'gaining' ? (
                  <Rect key={d.date} testID="season-weight-day-gaining" x={px} y={mid - hgt} width={dayW} height={hgt} fill={c.green} />
                ) : (
                  <Rect key={d.date} testID="season-weight-day-losing" x={px} y={mid} width={dayW} height={hgt} fill={c.red} />
                );
              })}
            </>
          );
        },
      });
    }
  }

  // Layout: each panel has a title line above it and the month axis below the last one.
  const titleH = 26;
  // Room for the month names under each panel.
  const gap = 24;
  let yCursor = 0;
  const placed = panels.map((p) => {
    const top = yCursor + titleH;
    yCursor = top + p.height + gap;
    return { ...p, top };
  });
  const totalH = yCursor + 10;

  const select = (px: number) => {
    if (!onSelect || marks.length === 0) return;
    const mark = nearestMark(marks, x.invert(px).getTime());
    if (mark) onSelect(mark.id);
  };

  return (
    <View testID={`season-chart-${hive.id}`} style={{ width: w, maxWidth: '100%' }}>
      <Svg width={w} height={totalH} viewBox={`0 0 ${w} ${totalH}`} accessibilityLabel={`Season charts for ${hive.name}`}>
        {placed.map((p, i) => (
          <G key={p.key} testID={`season-panel-${p.key}`}>
            <SvgText x={PAD_LEFT} y={p.top - 8} fill={c.ink} {...bold}>
              {p.title}
            </SvgText>
            <Rect x={PAD_LEFT} y={p.top} width={w - PAD_LEFT - PAD_RIGHT} height={p.height} fill={c.surface} stroke={c.line} strokeWidth={1} />
            {monthTicks(p.top, p.height, !compact || i === placed.length - 1)}
            {p.draw(p.top, p.height)}
            {inspectionTicks(p.top, p.height)}
            {selectedT != null ? (
              <Line testID="season-selection-rule" x1={x(new Date(selectedT))} x2={x(new Date(selectedT))} y1={p.top} y2={p.top + p.height} stroke={c.ink} strokeWidth={2} strokeDasharray="2 3" />
            ) : null}
            {selectedT != null && selectedLabel && i === 0 ? <SelectionLabel x={x(new Date(selectedT))} y={p.top + 4} text={selectedLabel} width={w} /> : null}
          </G>
        ))}
      </Svg>
      {/* One large transparent target over the drawing: taps and mouse moves pick the nearest record. */}
      <View
        testID={`season-chart-target-${hive.id}`}
        accessibilityElementsHidden
        importantForAccessibility="no-hide-descendants"
        onStartShouldSetResponder={() => Boolean(onSelect)}
        onResponderGrant={(e: GestureResponderEvent) => select(e.nativeEvent.locationX)}
        onPointerMove={(e) => {
          if (e.nativeEvent.pointerType === 'mouse') select(e.nativeEvent.offsetX);
        }}
        style={{ position: 'absolute', left: 0, top: 0, width: w, height: totalH }}
      />
      {legend ? (
        <View style={{ gap: t.space.xxs, paddingLeft: PAD_LEFT, paddingTop: t.space.xs }}>
          {placed.map((p) => (
            <SvgLegend key={p.key} title={p.title} text={p.legend} />
          ))}
        </View>
      ) : null}
    </View>
  );
}

/** The selected record's date and kind in a box above the first panel, kept inside the drawing. */
function SelectionLabel({ x, y, text, width }: { x: number; y: number; text: string; width: number }) {
  const t = useTheme();
  const boxW = Math.min(width - PAD_LEFT - PAD_RIGHT, 12 + text.length * 8.2);
  const left = Math.max(PAD_LEFT, Math.min(width - PAD_RIGHT - boxW, x - boxW / 2));
  return (
    <G testID="season-selection-label">
      <Rect x={left} y={y} width={boxW} height={22} rx={4} fill={t.colours.ink} />
      <SvgText x={left + boxW / 2} y={y + 16} textAnchor="middle" fill={t.colours.onInk} fontFamily={t.fontFamily.bold} fontSize={14}>
        {text}
      </SvgText>
    </G>
  );
}

function SvgLegend({ title, text }: { title: string; text: string }) {
  const t = useTheme();
  return (
    <Text variant="small" tone="muted">
      <Text variant="small" style={{ fontFamily: t.fontFamily.bold }}>{`${title}: `}</Text>
      {text}
    </Text>
  );
}
