"""``python -m dispatcher`` runs the same command line as the ``dispatcher`` script."""

import sys

from dispatcher.cli import main

sys.exit(main())
