/** Validation problems, each with the field it concerns. */
export function Problems({ problems }: { problems: { field: string; message: string }[] }) {
  return (
    <div role="alert" className="rounded-md border border-danger bg-danger-soft px-4 py-3 text-sm text-danger" data-testid="problems">
      <p className="font-semibold">Please fix:</p>
      <ul className="ml-5 list-disc">
        {problems.map((p, i) => (
          <li key={i}>
            <span className="font-mono">{p.field}</span>: {p.message}
          </li>
        ))}
      </ul>
    </div>
  );
}
