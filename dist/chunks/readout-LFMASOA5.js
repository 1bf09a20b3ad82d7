#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  findNamedPlan
} from "./chunk-FBZ7MJNX.js";
import {
  readTotalsAgainstPlan
} from "./chunk-HGOBTQHY.js";
import "./chunk-GIF3ITND.js";
import "./chunk-TH3NNBTK.js";
import "./chunk-G6K6KKMR.js";
import {
  requireWorkspace
} from "./chunk-ZWIGW2MY.js";
import "./chunk-V65C5FSR.js";
import "./chunk-NZ6ZJYU3.js";
import "./chunk-TLWZYCJO.js";
import "./chunk-JLYO35IC.js";
import "./chunk-6TRXKJK6.js";
import "./chunk-B52SKDPA.js";
import "./chunk-J3CQQVSX.js";
import {
  require_dist
} from "./chunk-LSO7NHYS.js";
import "./chunk-XJ3K7LET.js";
import "./chunk-MGCIOLH6.js";
import "./chunk-BXF2RWJM.js";
import {
  formatProblem
} from "./chunk-KAGGRZCD.js";
import {
  UsageError
} from "./chunk-OICJSZPX.js";
import "./chunk-ACAADDFF.js";
import "./chunk-PTQPFAEX.js";
import "./chunk-X2H4NLT2.js";
import "./chunk-5GP5B2QS.js";
import {
  __toESM
} from "./chunk-FUJ7I5KY.js";

// src/core/plan/record-outcome.ts
var import_yaml = __toESM(require_dist(), 1);
var DIGITS = 6;
var round = (x) => Number(x.toPrecision(DIGITS));
function recordOutcome(planText, readout, request) {
  if (readout.verdict === "not-read") return { ok: false, reason: "a readout with a sample ratio mismatch has no outcome to record: find the cause first" };
  const doc = (0, import_yaml.parseDocument)(planText);
  if (doc.errors.length || !(0, import_yaml.isMap)(doc.contents)) return { ok: false, reason: "the plan is not a YAML mapping that can be edited" };
  const existing = doc.contents.items.find((pair) => (0, import_yaml.isScalar)(pair.key) && pair.key.value === "outcome");
  const override = doc.getIn(["outcome", "override"]);
  const date = doc.getIn(["outcome", "date"]);
  const reason = doc.getIn(["outcome", "reason"]);
  const figures = readout.primary.arms.flatMap((a) => {
    const c = a.comparison;
    if (!c) return [];
    return [
      {
        arm: a.arm,
        metric: readout.primary.metric,
        difference: round(c.difference),
        low: round(c.interval.low),
        high: round(c.interval.high),
        ...c.relative ? { relative: round(c.relative.value) } : {},
        "p-value": round(a.adjustedP ?? c.pValue)
      }
    ];
  });
  const outcome = {
    class: readout.verdict,
    arms: readout.verdictArms,
    "data-through": readout.dataThrough,
    totals: request.totalsFile,
    ...readout.timing.readEarly ? { "read-early": true } : {},
    figures,
    "decided-by": request.decidedBy,
    "recorded-on": request.recordedOn,
    ...date !== void 0 ? { date } : {},
    ...reason !== void 0 ? { reason } : {},
    ...override !== void 0 ? { override } : {}
  };
  const block = new import_yaml.Document({ outcome });
  const node = block.getIn(["outcome"], true);
  const arms = node.get("arms", true);
  if ((0, import_yaml.isSeq)(arms)) arms.flow = true;
  const listed = node.get("figures", true);
  if ((0, import_yaml.isSeq)(listed)) {
    for (const item of listed.items) if ((0, import_yaml.isMap)(item)) item.flow = true;
  }
  const over = node.get("override", true);
  if ((0, import_yaml.isMap)(over)) over.flow = true;
  const blockText = block.toString({ lineWidth: 0, flowCollectionPadding: false });
  if (!existing) {
    const separated = planText.length === 0 || planText.endsWith("\n") ? planText : `${planText}
`;
    return { ok: true, text: `${separated}${blockText}` };
  }
  const keyStart = existing.key.range[0];
  const lineStart = planText.lastIndexOf("\n", keyStart - 1) + 1;
  const valueEnd = existing.value?.range?.[1] ?? existing.key.range[1];
  const restStart = planText.indexOf("\n", valueEnd);
  const rest = restStart === -1 ? "" : planText.slice(restStart + 1);
  return { ok: true, text: `${planText.slice(0, lineStart)}${blockText}${rest}` };
}

// src/run/readout.ts
async function readOutPlan(options) {
  const workspace = await requireWorkspace(options);
  const found = findNamedPlan(workspace, options.plan, "read out");
  const text = await options.files.readText(options.totals);
  if (text === void 0) throw new UsageError(`the totals file ${options.totals} does not exist`, "the path is relative to --cwd (the repository root)");
  const loaded = await readTotalsAgainstPlan({ plan: found.plan, planFile: found.file, totalsFile: options.totals, totalsText: text, ...options.history ? { history: options.history } : {} });
  if (!loaded.ok) {
    throw new UsageError(`${options.totals} cannot be read out:
${[...loaded.errors, ...loaded.warnings].map(formatProblem).join("\n")}`, "see docs/totals-reference.md for the format");
  }
  const { readout } = loaded;
  const outcome = { readout, planFile: found.file, warnings: loaded.warnings };
  if (options.record) {
    const planText = await options.files.readText(found.file);
    if (planText === void 0) throw new UsageError(`the plan file ${found.file} disappeared while reading`);
    const recorded = recordOutcome(planText, readout, { ...options.record, totalsFile: options.totals });
    if (!recorded.ok) throw new UsageError(`nothing recorded: ${recorded.reason}`);
    outcome.recordedText = recorded.text;
  }
  return outcome;
}
export {
  readOutPlan
};
