// Browser only: a figure mark's tooltip shown on keyboard focus too, not on hover alone. Marks
// that carry one (data-tip, set by the plot builder) take focus; the tip sits beside the focused
// mark and is the mark's description for assistive technology while it shows.
export function listenForFocusTips(): void {
  const tip = document.createElement('div');
  tip.className = 'focus-tip';
  tip.id = 'focus-tip';
  tip.setAttribute('role', 'tooltip');
  tip.hidden = true;
  document.body.append(tip);
  document.addEventListener('focusin', (event) => {
    const mark = (event.target as Element | null)?.closest?.('[data-tip]');
    if (!mark) return;
    tip.textContent = mark.getAttribute('data-tip');
    const box = mark.getBoundingClientRect();
    tip.style.left = `${Math.round(box.right + 8 + window.scrollX)}px`;
    tip.style.top = `${Math.round(box.top - 6 + window.scrollY)}px`;
    tip.hidden = false;
    mark.setAttribute('aria-describedby', tip.id);
  });
  document.addEventListener('focusout', (event) => {
    const mark = (event.target as Element | null)?.closest?.('[data-tip]');
    if (!mark) return;
    tip.hidden = true;
    mark.removeAttribute('aria-describedby');
  });
}
