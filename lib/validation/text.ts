import { z } from 'zod';

/**
 * Control characters PostgreSQL or a reader cannot take: NUL and the other C0 controls except
 * tab, line feed and carriage return, plus DEL.
 */
const CONTROL = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F]/;
/** A UTF-16 surrogate half without its partner (cannot be stored as UTF-8). */
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

/** The problem with a string's characters, or undefined when every character can be stored and shown. */
export function textProblem(s: string): string | undefined {
  if (CONTROL.test(s)) return 'Remove the invisible control characters from this text.';
  if (LONE_SURROGATE.test(s)) return 'This text contains a broken character; retype it.';
  return undefined;
}

/**
 * The one string schema for text that people or clients send: refuses NUL, other control
 * characters (tab and newlines are fine) and lone UTF-16 surrogates with a plain message.
 * Chain as usual: `safeText().trim().min(3).max(120)`.
 */
export function safeText() {
  return z.string().check((ctx) => {
    const problem = textProblem(ctx.value);
    if (problem) ctx.issues.push({ code: 'custom', message: problem, input: ctx.value });
  });
}
