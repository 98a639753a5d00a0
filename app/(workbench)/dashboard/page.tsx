import type { Metadata } from "next";
import { StudiesDashboard } from "@/components/studies/studies-dashboard";

export const metadata: Metadata = { title: "Studies" };

export default function DashboardPage() {
  return <StudiesDashboard />;
}
