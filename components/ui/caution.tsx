/** The safety note every evaluation and calculation screen carries. */
export function Caution() {
  return (
    <p role="note" className="rounded border border-caution-line bg-caution-bg px-3 py-2 text-xs text-caution">
      <strong>Engineering estimate.</strong> Results hold only within the stated validity ranges and property basis.
      Check them under the applicable codes, and have them reviewed by a responsible licensed engineer, before they enter a design.
    </p>
  );
}
