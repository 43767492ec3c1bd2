// JSON shapes of class sessions, their attendance registers and a student's hours.
import type { AttendanceStatus, SectionName } from "@/lib/domain/attendance";

export interface SessionDto {
  id: string;
  classId: string;
  className: string;
  startsAt: string;
  minutes: number;
  section: string;
  subject: string;
  closedAt: string | null;
  counts: Record<AttendanceStatus | "unrecorded", number>;
}

export interface AttendanceEntryDto {
  id: string;
  userId: string;
  status: AttendanceStatus;
  minutes: number;
  makeup: string;
  makeupRunId: string | null;
  correctionReason: string;
  recordedByName: string;
  recordedAt: string;
}

export interface SessionDetailDto extends SessionDto {
  roster: { userId: string; name: string; current: AttendanceEntryDto | null; history: AttendanceEntryDto[] }[];
}

export interface StudentAttendanceDto {
  student: { id: string; name: string };
  minutesBySection: Record<SectionName, number>;
  sessions: (Omit<SessionDto, "counts"> & { entry: AttendanceEntryDto | null })[];
}
