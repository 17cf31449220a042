import type { ComponentChildren } from 'preact';
import { isoWithOffset } from '../../records/time';
import { showOffset } from '../format';


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

/**
 * An optional section that opens and closes with one tap; whether it is open is kept by the
 * caller (per crew, see folds.ts). `extra` is a short summary shown on the closed header.
 */
export function Fold(p: { id: string; title: string; open: boolean; onToggle: (open: boolean) => void; extra?: string; children: ComponentChildren }) {
  return (
    <details class="section fold" id={p.id} open={p.open} onToggle={(e) => p.onToggle((e.currentTarget as HTMLDetailsElement).open)}>
      <summary>
        <span class="fold-title">{p.title}</span>
        {p.extra && <span class="fold-extra">{p.extra}</span>}
      </summary>
      {p.open && <div class="section-body">{p.children}</div>}
    </details>
  );
}

interface CoreFieldProps {
  id: string;
  label: string;
  value: string;
  onInput: (v: string) => void;
  error?: string | undefined;
  /** the unit as text, or a unit picker (a select) */
  unit?: ComponentChildren;
  /** id of the field the keyboard's "next" key goes to; empty: "done" (closes the keyboard) */
  next?: string;
  status?: ComponentChildren;
}

/**
 * One reading on one line: label, a number box with the decimal keypad, its unit. The keyboard's
 * "next" key moves to the following reading (handled by the form, see moveOnEnter).
 */
export function CoreField(p: CoreFieldProps) {
  const errId = `${p.id}-err`;
  return (
    <div class={p.error ? 'core-row has-error' : 'core-row'}>
      <label for={p.id}>{p.label}</label>
      <input
        id={p.id}
        inputMode="decimal"
        enterKeyHint={p.next ? 'next' : 'done'}
        data-next={p.next ?? ''}
        autoComplete="off"
        spellcheck={false}
        value={p.value}
        aria-invalid={p.error ? true : undefined}
        aria-describedby={p.error ? errId : undefined}
        onInput={(e) => p.onInput((e.currentTarget as HTMLInputElement).value)}
      />
      <span class="core-unit">{p.unit}</span>
      {p.status && <div class="core-status">{p.status}</div>}
      {p.error && <p id={errId} class="field-error core-error" role="alert">{p.error}</p>}
    </div>
  );
}

/** Keyboard "next" on a reading moves to the next one (data-next); "done" closes the keyboard. */
export function moveOnEnter(e: KeyboardEvent): void {
  const el = e.target as HTMLElement | null;
  if (e.key !== 'Enter' || !(el instanceof HTMLInputElement) || !el.hasAttribute('data-next')) return;
  e.preventDefault(); // never submit the form from the keypad
  const next = el.getAttribute('data-next');
  const target = next ? document.getElementById(next) : null;
  if (target) target.focus();
  else el.blur();
}

/**
 * Date and time with the platform's own pickers. The sample keeps the UTC offset it was recorded
 * with: the picker edits the wall-clock time, the offset is carried over unchanged.
 */
export function TimeField(p: { id: string; label: string; iso: string; onChange: (iso: string) => void; error?: string | undefined }) {
  const m = /^(\d{4}-\d{2}-\d{2}T\d{2}:\d{2})(?::(\d{2}))?(Z|[+-]\d{2}:\d{2})$/.exec(p.iso);
  const local = m ? m[1]! : '';
  const offset = m ? m[3]! : isoWithOffset().slice(-6);
  return (
    <Labelled id={p.id} label={`${p.label} (${showOffset(`x${offset}`)})`} error={p.error}>
      <input
        id={p.id}
        type="datetime-local"
        value={local}
        aria-invalid={p.error ? true : undefined}
        onChange={(e) => {
          const v = (e.currentTarget as HTMLInputElement).value;
          if (v) p.onChange(`${v.slice(0, 16)}:00${offset}`);
        }}
      />
    </Labelled>
  );
}

/** A label above an input row, with its error said below. */
function Labelled(p: { id: string; label: string; error?: string | undefined; children: ComponentChildren }) {
  return (
    <div class={p.error ? 'field has-error' : 'field'}>
      <label for={p.id}>{p.label}</label>
      <div class="input-row">{p.children}</div>
      {p.error && <p class="field-error" role="alert">{p.error}</p>}
    </div>
  );
}

/** A calendar day with the platform's date picker (shown in the device's locale; kept as YYYY-MM-DD). */
export function DateField(p: { id: string; label: string; value: string; onChange: (date: string) => void }) {
  return (
    <div class="field">
      <label for={p.id}>{p.label}</label>
      <input id={p.id} type="date" value={p.value} onChange={(e) => { const v = (e.currentTarget as HTMLInputElement).value; if (v) p.onChange(v); }} />
    </div>
  );
}
