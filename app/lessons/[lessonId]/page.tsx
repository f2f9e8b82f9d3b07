import type { Metadata } from "next";
import { LessonView } from "@/components/lessons/lesson-view";
import { requireUser } from "@/lib/auth/session";

export const metadata: Metadata = { title: "Lesson" };

export default async function Page({ params }: { params: Promise<{ lessonId: string }> }) {
  const { lessonId } = await params;
  await requireUser(`/lessons/${lessonId}`);
  return <LessonView id={lessonId} />;
}
