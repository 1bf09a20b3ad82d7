"""Bramblecart search service: query suggestions."""
from openfeature import api

client = api.get_client("search-service")


def suggestions(query: str, catalogue: list[str], log) -> list[str]:
    log.event("search_performed", {"length": len(query)})
    if client.get_boolean_value("search-suggestions-v2", False):
        ranked = sorted((item for item in catalogue if query.lower() in item.lower()), key=len)
        return ranked[:8]
    return [item for item in catalogue if item.lower().startswith(query.lower())][:5]


def on_result_opened(item: str, log) -> None:
    log.event("search_result_opened", {"item": item})
