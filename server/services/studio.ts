// A studio: a teacher and the students linked to them.
import { fn, col } from 'sequelize';
import { Song, StudioLink, User } from '@/server/models';
import { HttpError, notFound } from '@/server/http';
import type { Student } from '@/shared/schemas';

export async function listStudents(teacherId: string): Promise<Student[]> {
  const links = await StudioLink.findAll({
    where: { teacherId },
    include: [{ model: User, as: 'student', attributes: ['id', 'name', 'email'] }],
    order: [['createdAt', 'ASC']],
  });
  const ids = links.map((l) => l.studentId);
  const counts = ids.length
    ? ((await Song.findAll({
        attributes: ['ownerId', [fn('COUNT', col('id')), 'n']],
        where: { ownerId: ids },
        group: ['ownerId'],
        raw: true,
      })) as unknown as { ownerId: string; n: number }[])
    : [];
  const byOwner = new Map(counts.map((c) => [c.ownerId, Number(c.n)]));
  return links.map((l) => {
    const s = (l as StudioLink & { student: User }).student;
    return { id: s.id, name: s.name, email: s.email, songCount: byOwner.get(s.id) ?? 0 };
  });
}

export async function addStudent(teacherId: string, email: string): Promise<void> {
  const student = await User.findOne({ where: { email } });
  if (!student) throw new HttpError(404, 'not_found', 'no Tactus account uses that e-mail address', 'email');
  if (student.id === teacherId) throw new HttpError(400, 'invalid_body', 'you cannot be your own student', 'email');
  await StudioLink.findOrCreate({ where: { teacherId, studentId: student.id } });
}

export async function removeStudent(teacherId: string, studentId: string): Promise<void> {
  const removed = await StudioLink.destroy({ where: { teacherId, studentId } });
  if (!removed) throw notFound('student');
}
