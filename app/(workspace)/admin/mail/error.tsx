"use client";
import { SegmentError } from "@/components/ui/segment-error";

export default function ErrorBoundary({ reset }: { error: Error; reset: () => void }) {
  return <SegmentError reset={reset} what="The captured mail" />;
}
