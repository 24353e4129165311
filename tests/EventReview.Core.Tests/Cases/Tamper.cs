namespace EventReview.Core.Tests.Cases;

/// <summary>Sets a property with a private setter, standing in for someone editing rows in the database.</summary>
public static class Tamper
{
    public static void Set<T>(T target, string property, object? value)
        where T : class =>
        (typeof(T).GetProperty(property) ?? throw new ArgumentException($"{typeof(T).Name} has no property {property}.", nameof(property)))
            .SetValue(target, value);
}
