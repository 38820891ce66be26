import { Router } from 'express';
import { handler } from '@/server/http';
import { currentUser, requireRole, requireUser } from '@/server/middleware/session';
import { endLink, listStudents, listTeachers } from '@/server/services/studio';

/** Mounted at /api/students: a teacher's students (linked by an accepted invitation). */
export const studentsRouter = Router();
studentsRouter.use(requireRole('teacher', 'admin'));

studentsRouter.get(
  '/',
  handler(async (req, res) => {
    res.json({ students: await listStudents(currentUser(req).id) });
  }),
);

studentsRouter.delete(
  '/:studentId',
  handler(async (req, res) => {
    await endLink(currentUser(req).id, String(req.params.studentId));
    res.status(204).end();
  }),
);

/** Mounted at /api/teachers: the teachers a player accepted, and ending a link from the student's side. */
export const teachersRouter = Router();
teachersRouter.use(requireUser);

teachersRouter.get(
  '/',
  handler(async (req, res) => {
    res.json({ teachers: await listTeachers(currentUser(req).id) });
  }),
);

teachersRouter.delete(
  '/:teacherId',
  handler(async (req, res) => {
    await endLink(String(req.params.teacherId), currentUser(req).id);
    res.status(204).end();
  }),
);
