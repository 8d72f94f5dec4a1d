/** A coloured box for messages: "info" (teal), "warn" (amber), "error" (red). */
export function NoticeBox({ tone = 'info', title, children }: { tone?: 'info' | 'warn' | 'error'; title?: string; children: React.ReactNode }) {
  const tones = {
    info: 'border-hush-500 bg-hush-50 text-hush-900',
    warn: 'border-flare-500 bg-flare-100 text-flare-700',
    error: 'border-alarm-600 bg-alarm-100 text-alarm-800',
  } as const;
  return (
    <div role={tone === 'error' ? 'alert' : 'status'} className={`rounded-lg border-l-4 p-3 ${tones[tone]}`}>
      {title && <p className="font-bold">{title}</p>}
      <div className="text-sm">{children}</div>
    </div>
  );
}
