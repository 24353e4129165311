namespace EventReview.Data.Tests.Fixtures;

/// <summary>Test classes in this collection share one <see cref="PostgresServer"/>.</summary>
[CollectionDefinition(Name)]
public sealed class PostgresCollection : ICollectionFixture<PostgresServer>
{
    public const string Name = "postgres";
}
