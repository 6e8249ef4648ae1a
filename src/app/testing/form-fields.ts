/** The input a <label> points at, found by the label's text (a trailing required-field asterisk is ignored). */
export function fieldLabelled(page: HTMLElement, label: string): HTMLInputElement {
  const labelElement = [...page.querySelectorAll('label')].find((each) => each.textContent?.trim().replace(/\s*\*$/, '') === label);
  const input = labelElement?.htmlFor ? page.querySelector<HTMLInputElement>(`#${labelElement.htmlFor}`) : null;
  if (!input) throw new Error(`No field labelled ${label}`);
  return input;
}

/** Types into a labelled field as a person would; `leave` also moves focus away (fields that format on blur). */
export function typeInto(page: HTMLElement, label: string, value: string, { leave = false } = {}): void {
  const input = fieldLabelled(page, label);
  input.value = value;
  input.dispatchEvent(new Event('input'));
  if (leave) input.dispatchEvent(new Event('blur'));
}
