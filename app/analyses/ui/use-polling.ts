import { useEffect } from "react";
import { useRevalidator } from "react-router";

/** Revalidates the page's loader every `ms` while `active` (an analysis or a follow-up is unfinished). */
export function usePolling(active: boolean, ms = 1000): void {
  const revalidator = useRevalidator();
  useEffect(() => {
    if (!active) return;
    const id = setInterval(() => {
      if (revalidator.state === "idle") void revalidator.revalidate();
    }, ms);
    return () => clearInterval(id);
  }, [active, ms, revalidator]);
}
