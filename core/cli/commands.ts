// Registers every command's handler (each lives in its own module).
import './inspect';
import './route';
export {};
