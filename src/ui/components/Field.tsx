import type { ComponentChildren } from 'preact';


interface TextFieldProps {
  id: string;
  label: string;
  value: string;
  onInput: (v: string) => void;
  unit?: string;
  error?: string | undefined;
  hint?: string;
  numeric?: boolean;
  placeholder?: string;
  type?: 'text' | 'url' | 'password' | 'email';
  autoFocus?: boolean;
}

const UNIT_WORDS: Record<string, string> = { 'mg/L CaCO3': 'mg/L as CaCO₃', 'mg/L HCO3': 'mg/L as HCO₃', 'uS/cm': 'µS/cm' };

/** A labelled input; numbers get the decimal keypad. The error is said in words beside it. */
export function TextField(p: TextFieldProps) {
  const errId = `${p.id}-err`;
  const hintId = `${p.id}-hint`;
  return (
    <div class={p.error ? 'field has-error' : 'field'}>
      <label for={p.id}>{p.label}</label>
      <div class="input-row">
        <input
          id={p.id}
          type={(p.type ?? 'text') as 'text'}
          inputMode={p.numeric ? 'decimal' : undefined}
          autoComplete="off"
          spellcheck={false}
          value={p.value}
          placeholder={p.placeholder}
          aria-invalid={p.error ? true : undefined}
          aria-describedby={[p.error ? errId : '', p.hint ? hintId : ''].filter(Boolean).join(' ') || undefined}
          onInput={(e) => p.onInput((e.currentTarget as HTMLInputElement).value)}
          autoFocus={p.autoFocus}
        />
        {p.unit && <span class="unit">{UNIT_WORDS[p.unit] ?? p.unit}</span>}
      </div>
      {p.hint && <p id={hintId} class="hint">{p.hint}</p>}
      {p.error && <p id={errId} class="field-error" role="alert">{p.error}</p>}
    </div>
  );
}

interface ChoiceProps<T extends string> {
  label: string;
  value: T;
  options: ReadonlyArray<{ value: T; label: string }>;
  onChange: (v: T) => void;
  name: string;
}

/** A row of large toggle buttons (a radio group), easier with gloves than a dropdown. */
export function Choice<T extends string>(p: ChoiceProps<T>) {
  return (
    <fieldset class="choice">
      <legend>{p.label}</legend>
      <div class="choice-row">
        {p.options.map((o) => (
          <label key={o.value} class={o.value === p.value ? 'choice-opt on' : 'choice-opt'}>
            <input type="radio" name={p.name} value={o.value} checked={o.value === p.value} onChange={() => p.onChange(o.value)} />
            {o.label}
          </label>
        ))}
      </div>
    </fieldset>
  );
}

export function SelectField(p: { id: string; label: string; value: string; onChange: (v: string) => void; children: ComponentChildren; error?: string | undefined }) {
  return (
    <div class={p.error ? 'field has-error' : 'field'}>
      <label for={p.id}>{p.label}</label>
      <select id={p.id} value={p.value} onChange={(e) => p.onChange((e.currentTarget as HTMLSelectElement).value)}>
        {p.children}
      </select>
      {p.error && <p class="field-error">{p.error}</p>}
    </div>
  );
}

export function Section(p: { title: string; children: ComponentChildren; open?: boolean; id?: string }) {
  return (
    <details class="section" open={p.open ?? true} id={p.id}>
      <summary>{p.title}</summary>
      <div class="section-body">{p.children}</div>
    </details>
  );
}
