namespace EventReview.Core.Records;

/// <summary>
/// One statement a timeline entry makes about the record: a name (<c>case.state</c>, <c>item[timing.arrival].owner</c>,
/// <c>signoff[timing.arrival]+</c>, ...; see <see cref="FactNames"/>) and its value after the change. Names ending in
/// '+' add a row (a seal of it) instead of setting a value.
/// </summary>
public readonly record struct Fact(string Name, string Value);
