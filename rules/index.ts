// Every rule, in the order they run and are listed. A new rule adds one import and one entry.
// model-coverage stays last: it lists what the rules before it could not check (lint() also
// moves it to the end, so a rule added after it cannot slip past).
import type { Context } from "../src/engine/context.js";
import type { Rule } from "../src/engine/rule.js";
import { baseAcGround } from "./base-ac-ground.js";
import { biasCentre } from "./bias-centre.js";
import { cornerFrequency } from "./corner-frequency.js";
import { eSeries } from "./e-series.js";
import { gateProtection } from "./gate-protection.js";
import { modelCoverage } from "./model-coverage.js";
import { railBypass } from "./rail-bypass.js";
import { ratings } from "./ratings.js";
import { stackHeadroom } from "./stack-headroom.js";

export const allRules: Rule<Context>[] = [
  railBypass, baseAcGround, gateProtection, eSeries, stackHeadroom, biasCentre, cornerFrequency, ratings, modelCoverage,
];
