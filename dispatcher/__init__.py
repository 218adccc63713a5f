"""dispatcher: decide which waiting job goes to which machine, and prove the choice is best."""

__version__ = "0.1.0"
