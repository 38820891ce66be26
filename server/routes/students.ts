import { Router } from 'express';
import { handler, parseBody } from '@/server/http';
import { currentUser, requireRole } from '@/server/middleware/session';
import { AddStudentSchema } from '@/shared/schemas';
import { addStudent, listStudents, removeStudent } from '@/server/services/studio';

export const studentsRouter = Router();
studentsRouter.use(requireRole('teacher', 'admin'));

studentsRouter.get('/', handler(async (req, res) => {
  res.json({ students: await listStudents(currentUser(req).id) });
}));

studentsRouter.post('/', handler(async (req, res) => {
  const { email } = parseBody(AddStudentSchema, req.body);
  await addStudent(currentUser(req).id, email);
  res.status(201).json({ students: await listStudents(currentUser(req).id) });
}));

studentsRouter.delete('/:studentId', handler(async (req, res) => {
  await removeStudent(currentUser(req).id, String(req.params.studentId));
  res.status(204).end();
}));
