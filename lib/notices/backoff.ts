/**
 * Wait before try n+1 after n failed tries: base, 2 x base, 4 x base ... capped (exponential
 * backoff, common practice, no source). Pure: the outbox worker and its unit test use it.
 * @param attempts tries made so far (1 after the first failure)
 * @param baseMs the first wait, milliseconds
 * @param capMs the longest wait, milliseconds
 */
export const backoffMs = (attempts: number, baseMs: number, capMs: number) => Math.min(capMs, baseMs * 2 ** Math.max(0, attempts - 1));
