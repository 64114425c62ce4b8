import { Circle, Document, G, Line, Page, Polyline, Rect, StyleSheet, Svg, Text, View, renderToBuffer } from "@react-pdf/renderer";
import type { ReactNode } from "react";
import { REPORT_FONTS, registerReportFonts } from "./fonts";
import type { PlanReport, ReportTable, ReportThread } from "./plan-report-data";

const INK = "#143234";
const SOFT = "#52606d";
const RULE = "#c9d1d3";
const OCHRE_BG = "#f6ecd6";
const OCHRE = "#8a5a12";
const CLAY = "#b5523b";
const FONT = REPORT_FONTS[0];

const s = StyleSheet.create({
  page: { fontFamily: REPORT_FONTS, fontSize: 9.5, color: INK, paddingTop: 44, paddingBottom: 70, paddingHorizontal: 40 },
  watermark: { position: "absolute", top: 330, left: 70, fontSize: 120, fontWeight: 700, color: CLAY, opacity: 0.12, transform: "rotate(-35deg)" },
  runningHead: { position: "absolute", top: 18, left: 40, right: 40, fontSize: 7.5, color: SOFT, flexDirection: "row", justifyContent: "space-between" },
  brand: { fontSize: 9, fontWeight: 700, color: "#3d8184" },
  h1: { fontSize: 20, fontWeight: 700, marginTop: 4, lineHeight: 1.2 },
  sub: { fontSize: 10.5, color: SOFT, marginTop: 2 },
  draft: { marginTop: 8, padding: 8, borderWidth: 1.5, borderColor: CLAY, color: CLAY, fontSize: 12, fontWeight: 700 },
  caution: { marginTop: 10, padding: 8, backgroundColor: OCHRE_BG, borderLeftWidth: 4, borderLeftColor: "#c08a2e", color: OCHRE },
  cautionTitle: { fontWeight: 700, marginBottom: 2 },
  summary: { flexDirection: "row", marginTop: 10, gap: 6 },
  stat: { flexGrow: 1, flexBasis: 0, borderWidth: 0.75, borderColor: RULE, padding: 5 },
  statLabel: { fontSize: 7.5, color: SOFT },
  statValue: { fontSize: 10.5, fontWeight: 600 },
  h2: { fontSize: 13, lineHeight: 1.2, fontWeight: 700, marginTop: 16, marginBottom: 6, paddingBottom: 2, borderBottomWidth: 0.75, borderBottomColor: RULE },
  h3: { fontSize: 10.5, lineHeight: 1.2, fontWeight: 700, marginTop: 8, marginBottom: 3 },
  caption: { fontSize: 8, color: SOFT, marginTop: 3 },
  note: { fontSize: 8, color: SOFT, marginTop: 4 },
  tr: { flexDirection: "row", borderBottomWidth: 0.5, borderBottomColor: RULE, paddingVertical: 2.5 },
  th: { fontWeight: 700, fontSize: 8, color: SOFT },
  td: { fontSize: 8.5, paddingRight: 4 },
  num: { textAlign: "right" },
  kv: { flexDirection: "row", paddingVertical: 1.5 },
  kvLabel: { width: 160, color: SOFT },
  kvValue: { flex: 1 },
  thread: { marginTop: 8, borderLeftWidth: 2, borderLeftColor: RULE, paddingLeft: 8 },
  comment: { marginTop: 4 },
  meta: { fontSize: 7.5, color: SOFT },
  response: { marginTop: 4, padding: 5, backgroundColor: "#eef3f3" },
  footer: { position: "absolute", bottom: 20, left: 40, right: 40, borderTopWidth: 0.75, borderTopColor: RULE, paddingTop: 4, fontSize: 7, color: OCHRE },
  footerLine: { flexDirection: "row", justifyContent: "space-between", color: SOFT, marginTop: 2 },
  legendRow: { flexDirection: "row", alignItems: "center", marginBottom: 3 },
  swatch: { width: 14, height: 4, marginRight: 5 },
});

/**
 * A titled section. `first` is laid out with the title in one unbreakable block, so a title
 * is never left alone at the foot of a page when its first block is itself unbreakable
 * (minPresenceAhead alone does not move the title with a block taller than the space left).
 */
function Section({ title, children, first, breakBefore = false }: { title: string; children: ReactNode; first?: ReactNode; breakBefore?: boolean }) {
  const heading = (
    <Text style={s.h2} minPresenceAhead={120}>
      {title}
    </Text>
  );
  return (
    <View break={breakBefore}>
      {first ? (
        <View wrap={false}>
          {heading}
          {first}
        </View>
      ) : (
        heading
      )}
      {children}
    </View>
  );
}

/** One group of the methods: its heading and label–value rows. */
function MethodGroup({ group }: { group: { heading: string; items: { label: string; value: string }[] } }) {
  return (
    <>
      <Text style={s.h3}>{group.heading}</Text>
      {group.items.map((i) => (
        <View key={i.label} style={s.kv}>
          <Text style={s.kvLabel}>{i.label}</Text>
          <Text style={s.kvValue}>{i.value}</Text>
        </View>
      ))}
    </>
  );
}

function Table({ table, widths }: { table: ReportTable; widths: number[] }) {
  const cell = (i: number) => [s.td, { flex: widths[i] ?? 1 }, table.numeric[i] ? s.num : {}];
  return (
    <View>
      <View style={s.tr} fixed>
        {table.columns.map((c, i) => (
          <Text key={c} style={[...cell(i), s.th]}>
            {c}
          </Text>
        ))}
      </View>
      {table.rows.map((row, r) => (
        <View key={r} style={s.tr} wrap={false}>
          {row.map((v, i) => (
            <Text key={i} style={cell(i)}>
              {v}
            </Text>
          ))}
        </View>
      ))}
    </View>
  );
}

const svgText = (size: number, colour = SOFT) => ({ fontFamily: FONT, fontSize: size, fill: colour });

function ProfileChart({ f }: { f: NonNullable<PlanReport["profile"]> }) {
  const { plot } = f;
  const bottom = plot.y + plot.h;
  return (
    <Svg width={f.width} height={f.height}>
      {f.yTicks.map((t) => (
        <G key={`y${t.label}`}>
          <Line x1={plot.x} y1={t.at} x2={plot.x + plot.w} y2={t.at} stroke={RULE} strokeWidth={0.4} />
          <Text x={plot.x - 4} y={t.at + 2.5} textAnchor="end" style={svgText(7)}>
            {t.label}
          </Text>
        </G>
      ))}
      {f.xTicks.map((t) => (
        <Text key={`x${t.label}`} x={t.at} y={bottom + 10} textAnchor="middle" style={svgText(7)}>
          {t.label}
        </Text>
      ))}
      {f.reachBreaks.map((b) => (
        <Line key={`r${b.id}`} x1={b.x} y1={plot.y} x2={b.x} y2={bottom} stroke={RULE} strokeWidth={0.6} strokeDasharray="1,2" />
      ))}
      <Rect x={plot.x} y={plot.y} width={plot.w} height={plot.h} stroke={SOFT} strokeWidth={0.6} fill="none" />
      <Line x1={plot.x} y1={f.criterionY} x2={plot.x + plot.w} y2={f.criterionY} stroke={CLAY} strokeWidth={1} strokeDasharray="5,3" />
      <Polyline points={f.saturationLine} fill="none" stroke="#7b8f4a" strokeWidth={0.8} strokeDasharray="1.5,1.5" />
      <Polyline points={f.doLine} fill="none" stroke={INK} strokeWidth={1.6} strokeLinejoin="round" />
      {f.dischargers.map((d, i) => (
        <G key={`d${d.id}`}>
          <Circle cx={d.x} cy={bottom} r={2.4} fill="#ffffff" stroke={INK} strokeWidth={0.8} />
          <Text x={d.x} y={bottom - 4 - (i % 2) * 8} textAnchor="middle" style={svgText(6, INK)}>
            {d.id}
          </Text>
        </G>
      ))}
      <Circle cx={f.lowest.x} cy={f.lowest.y} r={2.6} fill={CLAY} />
      <Text x={plot.x + plot.w / 2} y={f.height - 2} textAnchor="middle" style={svgText(7.5)}>
        {f.xLabel}
      </Text>
      <Text x={plot.x} y={plot.y - 5} style={svgText(7.5)}>
        DO (mg/L)
      </Text>
    </Svg>
  );
}

function MapFigure({ f }: { f: NonNullable<PlanReport["map"]> }) {
  const { x, y, metric, imperial } = f.scale;
  const bar = (len: number, at: number, label: string) => (
    <G>
      <Rect x={x} y={at - 2.5} width={len} height={2.5} fill={INK} />
      <Line x1={x} y1={at - 5} x2={x} y2={at} stroke={INK} strokeWidth={0.6} />
      <Line x1={x + len} y1={at - 5} x2={x + len} y2={at} stroke={INK} strokeWidth={0.6} />
      <Text x={x + len + 3} y={at} style={svgText(6, INK)}>
        {label}
      </Text>
    </G>
  );
  return (
    <View style={{ flexDirection: "row", gap: 14, alignItems: "flex-start" }} wrap={false}>
      <Svg width={f.width} height={f.height}>
        <Rect x={0} y={0} width={f.width} height={f.height} fill="#f7f8f6" stroke={RULE} strokeWidth={0.6} />
        {f.lines.map((l, i) => (
          <Polyline key={i} points={l.points} fill="none" stroke={l.colour} strokeWidth={2.4} strokeLinecap="round" strokeLinejoin="round" />
        ))}
        {f.outfalls.map((o) => (
          <G key={o.id}>
            <Circle cx={o.x} cy={o.y} r={2.6} fill="#ffffff" stroke={INK} strokeWidth={0.9} />
            {o.label && (
              <Text x={o.label.x} y={o.label.y} textAnchor={o.label.anchor} style={svgText(6, INK)}>
                {o.id}
              </Text>
            )}
          </G>
        ))}
        {bar(metric.points, y - 9, metric.label)}
        {bar(imperial.points, y, imperial.label)}
        <G>
          <Polyline points={`${f.north.x - 4},${f.north.y + 13} ${f.north.x},${f.north.y + 3} ${f.north.x + 4},${f.north.y + 13} ${f.north.x},${f.north.y + 10}`} fill={INK} stroke={INK} strokeWidth={0.6} />
          <Text x={f.north.x} y={f.north.y + 21} textAnchor="middle" style={svgText(6.5, INK)}>
            N
          </Text>
        </G>
      </Svg>
      <View style={{ flex: 1, paddingTop: 4 }}>
        <Text style={s.h3}>Dissolved oxygen</Text>
        {f.legend.map((l) => (
          <View key={l.label} style={s.legendRow}>
            <View style={[s.swatch, { backgroundColor: l.colour }]} />
            <Text style={{ fontSize: 8 }}>{l.label}</Text>
          </View>
        ))}
        <View style={s.legendRow}>
          <Svg width={14} height={8} style={{ marginRight: 5 }}>
            <Circle cx={7} cy={4} r={2.6} fill="#ffffff" stroke={INK} strokeWidth={0.9} />
          </Svg>
          <Text style={{ fontSize: 8 }}>discharger outfall, with its permit id</Text>
        </View>
        <Text style={s.caption}>{f.caption}</Text>
      </View>
    </View>
  );
}

function Thread({ t }: { t: ReportThread }) {
  return (
    <View style={s.thread}>
      <Text style={s.h3} minPresenceAhead={40}>
        {t.topic} <Text style={s.meta}>— thread {t.status}</Text>
      </Text>
      {t.comments.map((c, i) => (
        <View key={i} style={s.comment} wrap={false}>
          <Text style={s.meta}>
            {c.author} ({c.role}), {c.at}
          </Text>
          <Text>{c.body}</Text>
        </View>
      ))}
      {t.response ? (
        <View style={s.response} wrap={false}>
          <Text style={s.meta}>
            Response by {t.responder ?? "the planners"}
            {t.respondedAt ? `, ${t.respondedAt}` : ""}
          </Text>
          <Text>{t.response}</Text>
        </View>
      ) : t.acknowledged ? null : (
        <Text style={[s.meta, { marginTop: 4 }]}>No response recorded.</Text>
      )}
      {t.acknowledged && <Text style={[s.meta, { marginTop: 4 }]}>{t.acknowledged}</Text>}
    </View>
  );
}

/** The plan report as a react-pdf document (A4): cautions first and in every page's footer. */
export function PlanPdf({ report: r }: { report: PlanReport }) {
  return (
    <Document title={`${r.title} — version ${r.version}`} author="Sagline" subject={`${r.basinName}: DO waste-load allocation plan`} creator="Sagline" producer="Sagline">
      <Page size="A4" style={s.page}>
        {!r.published && (
          <Text style={s.watermark} fixed>
            DRAFT
          </Text>
        )}
        <View style={s.runningHead} fixed>
          <Text>
            {r.basinName} — {r.title}, version {r.version}
          </Text>
          <Text>{r.published ? r.statusLine : "DRAFT — not published"}</Text>
        </View>

        <View style={s.footer} fixed>
          {r.caution.map((line) => (
            <Text key={line}>{line}</Text>
          ))}
          <View style={s.footerLine}>
            <Text>Generated by Sagline {r.generatedAt}</Text>
            <Text render={({ pageNumber, totalPages }) => `Page ${pageNumber} of ${totalPages}`} />
          </View>
        </View>

        <Text style={s.brand}>Sagline · plan report</Text>
        <Text style={s.h1}>{r.title}</Text>
        <Text style={s.sub}>
          {r.basinName} · version {r.version} · {r.statusLine}
        </Text>
        {!r.published && <Text style={s.draft}>{r.statusLine}. This is a working copy: the allocations may still change.</Text>}
        <View style={s.caution}>
          <Text style={s.cautionTitle}>Caution</Text>
          {r.caution.map((line) => (
            <Text key={line}>{line}</Text>
          ))}
        </View>
        <View style={s.summary}>
          {r.summary.map((x) => (
            <View key={x.label} style={s.stat}>
              <Text style={s.statLabel}>{x.label}</Text>
              <Text style={s.statValue}>{x.value}</Text>
            </View>
          ))}
        </View>
        {r.reviewLine && <Text style={s.note}>{r.reviewLine}</Text>}

        <Section title="Design conditions">
          <Table table={r.conditions} widths={[2.2, 1, 2.4, 1, 1]} />
          {r.conditions.rows.length > 1 && (
            <Text style={s.note}>
              The allocation is checked under every condition at once; the governing condition is the one with the lowest DO, and it stands for
              the plan in the figures below.
            </Text>
          )}
        </Section>

        {r.profile && (
          <View wrap={false}>
            <Text style={s.h2}>Dissolved oxygen from the farthest headwater to the outlet</Text>
            <ProfileChart f={r.profile} />
            <Text style={s.caption}>{r.profile.caption}</Text>
          </View>
        )}
        {r.map && (
          <View wrap={false}>
            <Text style={s.h2}>Map</Text>
            <MapFigure f={r.map} />
          </View>
        )}

        <Section title="Waste-load allocations">
          <Table table={r.allocations} widths={[2.2, 1.2, 1, 1.1, 1.1, 1, 1.1, 0.9]} />
          <Text style={s.note}>Effluent BOD5 is the allocated BOD5 load at the facility&apos;s design flow.</Text>
        </Section>
        {r.tmdl && (
          <Section title="TMDL">
            <Table table={r.tmdl} widths={[0.8, 3.5, 1.2]} />
            <Text style={s.note}>TMDL = ΣWLA + ΣLA + MOS + reserve.{r.tmdlNote ? ` ${r.tmdlNote}` : ""}</Text>
          </Section>
        )}

        <Section title="Methods and parameters" first={r.methods[0] && <MethodGroup group={r.methods[0]} />}>
          {r.methods.slice(1).map((m) => (
            <View key={m.heading} wrap={false}>
              <MethodGroup group={m} />
            </View>
          ))}
          {r.warnings.length > 0 && (
            <View>
              <Text style={s.h3}>Assumptions made while building the model file</Text>
              {r.warnings.map((w) => (
                <Text key={w}>• {w}</Text>
              ))}
            </View>
          )}
        </Section>

        <Section title="Responsiveness summary">
          {r.acknowledgement && <Text style={s.note}>{r.acknowledgement}</Text>}
          {r.responsiveness.length === 0 ? (
            <Text style={s.note}>No comments were received on this plan.</Text>
          ) : (
            r.responsiveness.map((t) => <Thread key={t.topic} t={t} />)
          )}
        </Section>

      </Page>
    </Document>
  );
}

/** Render the plan report to PDF bytes. */
export async function renderPlanPdf(report: PlanReport): Promise<Buffer> {
  registerReportFonts();
  return renderToBuffer(<PlanPdf report={report} />);
}
