import type { ImportProblem } from "@/lib/schedule/import/types";

export function ImportProblems({ problems }: { problems: ImportProblem[] }) {
  return (
    <table className="w-full text-left text-sm" aria-label="Problems in the file">
      <thead className="text-2xs uppercase tracking-wide text-muted">
        <tr>
          <th className="w-20 py-1 pr-3 font-medium">Line</th>
          <th className="py-1 font-medium">Problem</th>
        </tr>
      </thead>
      <tbody>
        {problems.map((p, i) => (
          <tr key={`${p.line}-${i}`} className="border-t border-line align-top">
            <td className="num py-1.5 pr-3 text-danger">{p.line > 0 ? p.line : "file"}</td>
            <td className="py-1.5">{p.reason}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
