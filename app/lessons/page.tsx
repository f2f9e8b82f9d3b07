import type { Metadata } from "next";
import { LessonsList } from "@/components/lessons/lessons-list";
import { requireUser } from "@/lib/auth/session";

export const metadata: Metadata = { title: "Lessons" };

export default async function Page() {
  await requireUser("/lessons");
  return (
    <div className="mx-auto max-w-7xl px-4 py-8 sm:px-6">
      <LessonsList />
    </div>
  );
}
