package thermal

import (
	"errors"

	"turnwise/coil"
)

func asInput(err error, target **coil.InputError) bool { return errors.As(err, target) }
