"""Package layout that pyproject.toml cannot express on its own.

The top-level ``resources/`` folder (icon, desktop entry, metainfo, translations) is the
source of truth and installs as the package ``dispatcher_resources`` beside
``dispatcher``; everything else is configured in pyproject.toml.
"""

from setuptools import find_packages, setup

setup(
    packages=find_packages(include=["dispatcher", "dispatcher.*"])
    + ["dispatcher_resources", "dispatcher_resources.icons", "dispatcher_resources.translations"],
    package_dir={"dispatcher_resources": "resources"},
)
