/**
 * The console language (LANGUAGE.md): parse a line, run it against a pad's context, and answer the result
 * shapes of API.md. Imports only the engine (src/lib/holo), mathjs (sandboxed) and zod.
 * Browser code that needs only completion and help should import './complete' and './help' directly —
 * this module pulls in mathjs and the engine.
 */
export { runLine, emptyContext, DEFAULT_BULK, DEFAULT_UNITS } from './evaluate';
export type { RunOptions } from './evaluate';
export { parse, parseExpression } from './parser';
export { lex } from './lexer';
export { printLine, printStatement, printExpr } from './printer';
export { LangError, isLangError, codeFrame } from './errors';
export { DEFAULT_LIMITS, LIMIT_NAMES, resolveLimits } from './limits';
export type { Limits } from './limits';
export { Tok } from './token';
export type { Token } from './token';
export type * from './ast';
export type * from './result';
export { complete } from './complete';
export type { Completion, CompletionResult } from './complete';
export { help, helpEntries } from './help';
export type { HelpEntry } from './help';
export { BULKS, SHAPES, SINKS, UNIT_SYSTEMS } from './vocab';
export { verbNames, verbSpec, verbSpecs, registerVerb, unregisterVerb, defineVerb } from './verbs/index';
export type { VerbSpec, VerbHelp } from './verbs/index';
export { closest, didYouMean } from './suggest';
export { sandboxEvaluate } from './arith';
