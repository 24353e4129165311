using Bunit;
using EventReview.Web.Tests.Fixtures;
using Microsoft.Extensions.DependencyInjection;

namespace EventReview.Web.Tests.Components;

/// <summary>
/// A bUnit context for components that call the app's services (item panel, run forms): MudBlazor as in
/// <see cref="MudTestContext"/>, and every other service from one scope of a real app over its own SQLite file.
/// </summary>
public abstract class AppBackedContext : MudTestContext
{
    private readonly AsyncServiceScope _scope;
    private bool _disposed;

    protected AppBackedContext(EventReviewFactory app)
    {
        App = app;
        _scope = app.Services.CreateAsyncScope();
        Services.AddFallbackServiceProvider(_scope.ServiceProvider);
    }

    /// <summary>The app behind the components.</summary>
    protected EventReviewFactory App { get; }

    /// <summary>A service of the app, from a scope of its own.</summary>
    protected T Get<T>() where T : notnull => App.Services.CreateScope().ServiceProvider.GetRequiredService<T>();

    /// <inheritdoc />
    protected override void Dispose(bool disposing)
    {
        // MudBlazor's scoped services (here and in the app's scope) can only be disposed asynchronously; the test
        // framework disposes test classes synchronously, so the asynchronous disposal is waited for here.
        if (disposing && !_disposed)
        {
            _disposed = true;
            DisposeAsync().AsTask().GetAwaiter().GetResult();
            _scope.DisposeAsync().AsTask().GetAwaiter().GetResult();
            return;
        }

        base.Dispose(disposing);
    }
}
