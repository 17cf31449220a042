/** A sample's readable ID as written on its bottle: monospace, never broken across lines. */
export function SampleCode({ code }: { code: string | undefined }) {
  if (!code) return null;
  return <code class="sample-code">{code}</code>;
}
