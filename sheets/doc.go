// Package sheets renders printable PDF build sheets for coils from the
// coil model's predictions. It reads coil and forms values and never
// re-derives physics.
package sheets
