// What passport puts on `req.user` (and socket.io on `socket.request.user`) once signed in.
declare global {
  namespace Express {
    interface User {
      id: string;
      email: string;
      name: string;
      createdAt: Date;
    }
  }
}

export {};
