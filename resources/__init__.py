"""Data files of the dispatcher app: icon, desktop entry, AppStream metainfo, translations.

This folder is installed as the package ``dispatcher_resources`` (see setup.py and
DEVELOPERS.md); code finds its files with :mod:`dispatcher.resources`, never by a path
into the checkout. Nothing here is code to run.
"""
