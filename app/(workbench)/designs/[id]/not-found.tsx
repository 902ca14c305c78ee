import Link from "next/link";
import { EmptyState } from "@/components/ui/panel";

export default function DesignNotFound() {
  return (
    <EmptyState title="That design was not found">
      It may belong to another team, or, if you are a maker, it may not be approved yet.{" "}
      <Link href="/designs" className="text-copper underline">
        Back to the designs
      </Link>
    </EmptyState>
  );
}
