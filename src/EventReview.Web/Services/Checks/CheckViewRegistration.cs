using Microsoft.AspNetCore.Components;

namespace EventReview.Web.Services.Checks;

/// <summary>Registers the components of a check kind (see <see cref="CheckView"/>).</summary>
public static class CheckViewRegistration
{
    /// <summary>Registers <typeparamref name="TRunner"/> and <typeparamref name="TResultView"/> for <paramref name="kind"/>.</summary>
    public static IServiceCollection AddCheckView<TRunner, TResultView>(this IServiceCollection services, string kind)
        where TRunner : IComponent
        where TResultView : IComponent =>
        services.AddSingleton(new CheckView(kind, typeof(TRunner), typeof(TResultView)));
}
