// A user's ranking expression over candidate fields, e.g. "burdenV * 1000 + errorAtMinPercent".
// Parsed and compiled once by a limited mathjs instance; only arithmetic on known fields and
// a short list of pure functions gets through (mathjs's security guidance, plus a tree walk).
import {
  all,
  create,
  isConstantNode,
  isFunctionNode,
  isOperatorNode,
  isParenthesisNode,
  isSymbolNode,
  type EvalFunction,
  type MathNode,
} from "mathjs";

/** Fields a ranking expression may use (lower result ranks first). */
export const rankFields = [
  "shuntOhms",
  "gain",
  "transimpedanceVPerA",
  "burdenV",
  "dissipationW",
  "ratingW",
  "outputAtMaxV",
  "lsbA",
  "offsetErrorA",
  "errorAtMinPercent",
  "countsAtMin",
  "bandwidthHz",
  "deadZoneA",
  "headroomV",
  "selfHeatingK",
] as const;
export type RankField = (typeof rankFields)[number];
export type RankScope = Record<RankField, number>;

const allowedFunctions = new Set([
  "abs",
  "sqrt",
  "cbrt",
  "exp",
  "log",
  "log10",
  "log2",
  "min",
  "max",
  "pow",
  "square",
  "round",
  "floor",
  "ceil",
]);
const allowedConstants = new Set(["pi", "e"]);
const allowedOperators = new Set(["add", "subtract", "multiply", "divide", "pow", "unaryMinus", "unaryPlus"]);

export class RankExpressionError extends Error {
  readonly field = "rank";
  constructor(message: string) {
    super(message);
    this.name = "RankExpressionError";
  }
}

/** The limited instance, made on first use (it costs a moment at start-up). */
let limitedParse: ((expr: string) => MathNode) | null = null;
function parser(): (expr: string) => MathNode {
  if (limitedParse) return limitedParse;
  const math = create(all as NonNullable<typeof all>);
  const parse = math.parse;
  const disabled = (name: string) => () => {
    throw new Error(`Function ${name} is disabled`);
  };
  math.import(
    {
      import: disabled("import"),
      createUnit: disabled("createUnit"),
      evaluate: disabled("evaluate"),
      parse: disabled("parse"),
      simplify: disabled("simplify"),
      derivative: disabled("derivative"),
      compile: disabled("compile"),
      resolve: disabled("resolve"),
      reviver: disabled("reviver"),
    },
    { override: true },
  );
  limitedParse = (expr: string) => parse(expr);
  return limitedParse;
}

const fieldSet = new Set<string>(rankFields);

function check(node: MathNode): void {
  // mathjs's own type guards narrow each node to its class, with its typed fields.
  if (isConstantNode(node)) {
    const v: unknown = node.value;
    if (typeof v !== "number" || !Number.isFinite(v))
      throw new RankExpressionError(
        `Ranking expression: only numbers are allowed as constants, not ${JSON.stringify(v)}`,
      );
    return;
  }
  if (isSymbolNode(node)) {
    if (!fieldSet.has(node.name) && !allowedConstants.has(node.name))
      throw new RankExpressionError(
        `Ranking expression: unknown name "${node.name}"; use candidate fields (${rankFields.join(", ")})`,
      );
    return;
  }
  if (isOperatorNode(node)) {
    if (!allowedOperators.has(node.fn))
      throw new RankExpressionError(`Ranking expression: operator "${node.op}" is not allowed; use + - * / ^`);
    node.args.forEach(check);
    return;
  }
  if (isParenthesisNode(node)) return check(node.content);
  if (isFunctionNode(node)) {
    const name = isSymbolNode(node.fn) ? node.fn.name : null;
    if (name === null || !allowedFunctions.has(name))
      throw new RankExpressionError(
        `Ranking expression: function "${name ?? "?"}" is not allowed; use ${[...allowedFunctions].join(", ")}`,
      );
    node.args.forEach(check);
    return;
  }
  switch (node.type) {
    case "AssignmentNode":
    case "FunctionAssignmentNode":
      throw new RankExpressionError("Ranking expression: assignments and function definitions are not allowed");
    case "BlockNode":
      throw new RankExpressionError("Ranking expression: give a single expression (no ';' or line breaks)");
    default:
      throw new RankExpressionError(
        `Ranking expression: ${node.type.replace(/Node$/, "").toLowerCase()} expressions are not allowed`,
      );
  }
}

export type CompiledRank = { source: string; evaluate: (scope: RankScope) => number };

/** Parse, vet and compile once. Throws RankExpressionError naming the problem. */
export function compileRankExpression(source: string): CompiledRank {
  if (typeof source !== "string" || source.trim() === "") throw new RankExpressionError("Ranking expression is empty");
  if (source.length > 500) throw new RankExpressionError("Ranking expression is longer than 500 characters");
  let node: MathNode;
  try {
    node = parser()(source);
  } catch (e) {
    throw new RankExpressionError(`Ranking expression: ${e instanceof Error ? e.message : String(e)}`);
  }
  check(node);
  const code: EvalFunction = node.compile();
  return {
    source,
    evaluate(scope) {
      const v: unknown = code.evaluate(scope);
      return typeof v === "number" && !Number.isNaN(v) ? v : Infinity;
    },
  };
}
